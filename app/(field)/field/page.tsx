import type { Metadata } from "next";
import { FieldHome } from "@/components/field/field-home";
import { requirePageActor } from "@/lib/auth/guard";
import { fieldReference } from "@/lib/queries/field-reference";

export const metadata: Metadata = { title: "My transects" };

// Rendered with fresh data when online; offline, the cached page and the phone's own copy take over.
export default async function FieldHomePage() {
  const actor = await requirePageActor(["volunteer"], "/field");
  return <FieldHome firstName={actor.name.split(" ")[0] ?? actor.name} initial={await fieldReference(actor)} />;
}
