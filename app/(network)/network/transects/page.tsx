import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { TransectsOverview } from "./transects-overview";

export const metadata: Metadata = { title: "Transects" };

export default async function TransectsPage() {
  await requirePageActor(["organiser"], "/network/transects");
  return <TransectsOverview tileUrl={env().MAP_TILE_URL ?? null} />;
}
