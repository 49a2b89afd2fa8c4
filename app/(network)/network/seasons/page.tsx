import type { Metadata } from "next";
import { requirePageActor } from "@/lib/auth/guard";
import { SeasonsManager } from "./seasons-manager";

export const metadata: Metadata = { title: "Seasons" };

export default async function SeasonsPage() {
  await requirePageActor(["organiser"], "/network/seasons");
  return <SeasonsManager />;
}
