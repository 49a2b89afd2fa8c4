import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { NewTransectForm } from "./new-transect-form";

export const metadata: Metadata = { title: "New transect" };

export default async function NewTransectPage() {
  await requirePageActor(["organiser"], "/network/transects/new");
  return <NewTransectForm tileUrl={env().MAP_TILE_URL ?? null} />;
}
