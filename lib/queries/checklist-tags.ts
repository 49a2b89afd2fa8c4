import "server-only";
import { asc, count, eq } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { speciesTagLinks, speciesTags } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { findTag, slugify } from "@/lib/checklist/tags";
import { invalid, notFound } from "@/lib/errors";
import { logChange } from "./change-log";
import { lockChecklist } from "./checklist-lock";

export type TagRow = { id: string; slug: string; label: string; description: string | null; species: number };

/** Species tags with how many entries carry each, by label. */
export function listTags(): Promise<TagRow[]> {
  return db()
    .select({ id: speciesTags.id, slug: speciesTags.slug, label: speciesTags.label, description: speciesTags.description, species: count(speciesTagLinks.speciesId) })
    .from(speciesTags)
    .leftJoin(speciesTagLinks, eq(speciesTagLinks.tagId, speciesTags.id))
    .groupBy(speciesTags.id)
    .orderBy(asc(speciesTags.label));
}

type TagInput = { label: string; description: string | null };

/** A label names one tag only: the same label, or one that a file would read as another tag's slug, is refused. */
async function refuseTaken(tx: Transaction, label: string, ownId: string | null) {
  const tags = await tx.select({ id: speciesTags.id, slug: speciesTags.slug, label: speciesTags.label }).from(speciesTags);
  const same = findTag(tags.filter((t) => t.id !== ownId), label);
  if (same) throw invalid({ label: [`That name is taken by the tag "${same.label}" (${same.slug}).`] });
}

/** Creates a tag; its slug comes from the label and stays the same when the tag is renamed. */
export async function createTag(actor: Pick<Actor, "id">, input: TagInput): Promise<TagRow> {
  return db().transaction(async (tx) => {
    await lockChecklist(tx);
    await refuseTaken(tx, input.label, null);
    const [row] = await tx.insert(speciesTags).values({ label: input.label, slug: slugify(input.label), description: input.description }).returning();
    await logChange(tx, actor, { entity: "species_tag", entityId: row!.id, action: "create", summary: `Created the species tag ${row!.label}`, after: { label: row!.label, slug: row!.slug, description: row!.description } });
    return { ...row!, species: 0 };
  });
}

/** Renames a tag (or changes its description); entries keep it, and analyses that name it by id still do. */
export async function updateTag(actor: Pick<Actor, "id">, id: string, input: TagInput): Promise<{ changed: boolean }> {
  return db().transaction(async (tx) => {
    await lockChecklist(tx);
    const [old] = await tx.select().from(speciesTags).where(eq(speciesTags.id, id)).for("update");
    if (!old) throw notFound("That tag");
    if (old.label === input.label && old.description === input.description) return { changed: false };
    await refuseTaken(tx, input.label, id);
    await tx.update(speciesTags).set({ label: input.label, description: input.description }).where(eq(speciesTags.id, id));
    const before = { label: old.label, description: old.description };
    const after = { label: input.label, description: input.description };
    await logChange(tx, actor, {
      entity: "species_tag",
      entityId: id,
      action: "update",
      summary: old.label === input.label ? `Changed the description of the species tag ${old.label}` : `Renamed the species tag ${old.label} to ${input.label}`,
      before,
      after,
    });
    return { changed: true };
  });
}
