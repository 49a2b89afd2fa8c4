import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { requirePageActor } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { TransectEditor } from "./transect-editor";

export const metadata: Metadata = { title: "Transect" };

export default async function TransectPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  await requirePageActor(["organiser"], `/network/transects/${encodeURIComponent(id)}`);
  if (!z.uuid().safeParse(id).success) notFound();
  return <TransectEditor id={id} tileUrl={env().MAP_TILE_URL ?? null} />;
}
