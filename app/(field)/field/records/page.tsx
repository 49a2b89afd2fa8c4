import type { Metadata } from "next";
import { MyRecords } from "@/components/field/my-records";
import { requirePageActor } from "@/lib/auth/guard";
import { walkSourcesOf } from "@/lib/queries/person-walks";

export const metadata: Metadata = { title: "My walks" };

export default async function RecordsPage() {
  const actor = await requirePageActor(["volunteer"], "/field/records");
  // Walks typed in for the volunteer or imported say so; the page is drawn with a signal, and
  // offline the phone's copy of the page keeps what it last said.
  return <MyRecords volunteerId={actor.id} sources={await walkSourcesOf(actor.id)} />;
}
