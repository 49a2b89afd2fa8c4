import type { Metadata } from "next";
import { MyRecords } from "@/components/field/my-records";
import { requirePageActor } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "My records" };

export default async function RecordsPage() {
  const actor = await requirePageActor(["volunteer"], "/field/records");
  return <MyRecords volunteerId={actor.id} />;
}
