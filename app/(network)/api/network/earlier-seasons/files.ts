import { AppError } from "@/lib/errors";
import { fileLabel, type ImportFileKind } from "@/lib/import/columns";
import { fileCapMessage, overFileCap } from "@/lib/import/file-check";
import type { SeasonImportInput } from "@/lib/queries/season-import";
import type { SeasonImportForm } from "../../../network/earlier-seasons/schema";

/** Each file read once into one buffer, after its size is checked (413 over the cap, before reading it). */
async function bytesOf(file: File, kind: ImportFileKind): Promise<{ fileName: string; bytes: Uint8Array }> {
  if (overFileCap(file.size)) throw new AppError(413, "too_large", fileCapMessage(fileLabel[kind], file.size));
  return { fileName: file.name.slice(0, 200) || `${kind}.csv`, bytes: new Uint8Array(await file.arrayBuffer()) };
}

export async function importInputOf(form: SeasonImportForm): Promise<SeasonImportInput> {
  return { seasonId: form.seasonId, recordStatus: form.recordStatus, walks: await bytesOf(form.walks, "walks"), sightings: await bytesOf(form.sightings, "sightings") };
}
