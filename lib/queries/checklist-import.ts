import "server-only";
import { createHash } from "node:crypto";
import { db } from "@/db/client";
import type { Actor } from "@/lib/auth/guard";
import { planChecklistImport, type ImportPlan } from "@/lib/checklist/plan";
import { readChecklistCsv } from "@/lib/checklist/read-csv";
import { ChecklistRefused } from "@/lib/checklist/refusal";
import { conflict } from "@/lib/errors";
import { applyPlan } from "./checklist-apply";
import { logChange } from "./change-log";
import { lockChecklist } from "./checklist-lock";
import { loadSnapshot, type LoadedSnapshot } from "./checklist-snapshot";

export type ImportPreview = { plan: ImportPlan; previewHash: string };

/** Names exactly what a plan would write: the confirm step must match the preview the organiser saw. */
function hashOf(plan: ImportPlan): string {
  return createHash("sha256").update(JSON.stringify(plan)).digest("base64url");
}

function planFile(text: string, snapshot: LoadedSnapshot): ImportPlan {
  const read = readChecklistCsv(text);
  if (!read.ok) throw new ChecklistRefused(read.problems);
  const planned = planChecklistImport(read, snapshot);
  if (!planned.ok) throw new ChecklistRefused(planned.problems);
  return planned.plan;
}

/** What importing this file would add and change; writes nothing. Throws ChecklistRefused with every problem. */
export async function previewChecklistImport(text: string): Promise<ImportPreview> {
  const plan = planFile(text, await loadSnapshot(db()));
  return { plan, previewHash: hashOf(plan) };
}

/**
 * Imports a checklist file in one transaction: the file is read and planned again against the
 * checklist as it stands under the checklist lock, and written only when that plan is the one
 * the organiser previewed (409 otherwise: someone changed the checklist, or the file differs).
 */
export async function importChecklist(actor: Pick<Actor, "id">, input: { fileName: string; text: string; previewHash: string }): Promise<ImportPlan["counts"] & { newTags: number }> {
  return db().transaction(async (tx) => {
    await lockChecklist(tx);
    const snapshot = await loadSnapshot(tx);
    const plan = planFile(input.text, snapshot);
    if (hashOf(plan) !== input.previewHash) {
      throw conflict("The checklist or the file has changed since the preview. Look at the new preview before importing.");
    }
    await applyPlan(tx, actor, plan, snapshot, { kind: "import", fileName: input.fileName });
    const { added, changed, unchanged } = plan.counts;
    const names = (status: string) => plan.entries.filter((e) => e.status === status).map((e) => e.values.scientificName);
    await logChange(tx, actor, {
      entity: "import",
      action: "import",
      summary: `Imported the checklist file ${input.fileName}: ${added} added, ${changed} changed, ${unchanged} unchanged${plan.newTags.length ? `; new tags: ${plan.newTags.join(", ")}` : ""}`,
      after: { fileName: input.fileName, added: names("new"), changed: names("changed"), newTags: plan.newTags },
    });
    return { ...plan.counts, newTags: plan.newTags.length };
  });
}
