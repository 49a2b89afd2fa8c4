import type { Metadata } from "next";
import { Suspense } from "react";
import { VisitScreen } from "@/components/field/visit/visit-screen";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Visit" };

export default async function VisitPage() {
  await requirePageActor(["volunteer"], "/field/visit");
  return (
    <Suspense fallback={<p>Loading…</p>}>
      <VisitScreen />
    </Suspense>
  );
}
