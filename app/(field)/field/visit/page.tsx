import type { Metadata } from "next";
import { Suspense } from "react";
import { VisitScreen } from "@/components/field/visit/visit-screen";
import { requirePageActor } from "@/lib/auth/guard";
import { fieldReference } from "@/lib/queries/field-reference";

export const metadata: Metadata = { title: "Walk" };

export default async function VisitPage() {
  const actor = await requirePageActor(["volunteer"], "/field/visit");
  const initial = await fieldReference(actor);
  return (
    <Suspense fallback={<p>Loading…</p>}>
      <VisitScreen initial={initial} />
    </Suspense>
  );
}
