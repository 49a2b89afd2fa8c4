import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { HabitatGroups } from "./habitat-groups";

export const metadata: Metadata = { title: "Habitat groups" };

export default async function HabitatGroupsPage() {
  await requirePageActor(["organiser"], "/network/habitats");
  return <HabitatGroups />;
}
