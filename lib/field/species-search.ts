export type ChecklistEntry = { id: string; scientificName: string; vernacularName: string; taxonRank: string; sensitive: boolean };

/** Lower case without accents, so "pieris" finds "Piéris" and "sorensen" finds "Sørensen". */
export function fold(text: string): string {
  return text
    .normalize("NFD")
    .replace(/\p{Diacritic}/gu, "")
    .replace(/ø/gi, "o")
    .replace(/æ/gi, "ae")
    .replace(/ß/g, "ss")
    .toLowerCase()
    .trim();
}

/**
 * Species matching the query by vernacular or scientific name, word starts first, and within
 * each rank the species already seen on this transect first (most often seen first).
 */
export function searchSpecies(checklist: ChecklistEntry[], query: string, seenHere: string[] = [], limit = 12): ChecklistEntry[] {
  const q = fold(query);
  const seenRank = new Map(seenHere.map((id, i) => [id, i]));
  const scored: { entry: ChecklistEntry; score: number; seen: number }[] = [];
  for (const entry of checklist) {
    const names = [fold(entry.vernacularName), fold(entry.scientificName)];
    let score: number;
    if (!q) score = 3;
    else if (names.some((n) => n.startsWith(q))) score = 0;
    else if (names.some((n) => n.split(/[\s/-]+/).some((w) => w.startsWith(q)))) score = 1;
    else if (names.some((n) => n.includes(q))) score = 2;
    else continue;
    scored.push({ entry, score, seen: seenRank.get(entry.id) ?? Number.MAX_SAFE_INTEGER });
  }
  scored.sort((a, b) => a.score - b.score || a.seen - b.seen || a.entry.vernacularName.localeCompare(b.entry.vernacularName));
  return scored.slice(0, limit).map((s) => s.entry);
}
