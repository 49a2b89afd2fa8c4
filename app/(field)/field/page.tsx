import type { Metadata } from "next";
import { FieldHome } from "@/components/field/field-home";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "My transects" };

// The page is a shell: its data comes from the phone's own store so it also works offline.
export default async function FieldHomePage() {
  const actor = await requirePageActor(["volunteer"], "/field");
  return <FieldHome firstName={actor.name.split(" ")[0] ?? actor.name} />;
}
