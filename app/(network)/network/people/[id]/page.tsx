import type { Metadata } from "next";
import { z } from "zod";
import { notFound } from "next/navigation";
import { requirePageActor } from "@/lib/auth/guard";
import { PersonEditor } from "./person-editor";

export const metadata: Metadata = { title: "Person" };

export default async function PersonPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const parsed = z.uuid().safeParse(id);
  await requirePageActor(["organiser"], parsed.success ? `/network/people/${parsed.data}` : "/network/people");
  if (!parsed.success) notFound();
  return <PersonEditor id={parsed.data} />;
}
