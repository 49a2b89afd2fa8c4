// Building, checking and aligning site-by-species tables (README.md, "What goes in").
import type { ExcludedSite, IndexName, PreparedPair, SpeciesRecord, SpeciesTable } from "./types";
import { isPresenceAbsence } from "./indices";

export class TableError extends Error {
  override name = "TableError";
}

export const REASON_ONLY_BEFORE = "only in the baseline survey (T1)";
export const REASON_ONLY_AFTER = "only in the comparison survey (T2)";
export const REASON_EMPTY = "no species recorded in either season";

/** Throws a TableError unless the table is rectangular, with unique names and values >= 0. */
export function validateTable(table: SpeciesTable, label = "table"): void {
  const seenSites = new Set<string>();
  for (const site of table.sites) {
    if (seenSites.has(site)) throw new TableError(`${label}: duplicate site "${site}"`);
    seenSites.add(site);
  }
  const seenSpecies = new Set<string>();
  for (const name of table.species) {
    if (seenSpecies.has(name)) throw new TableError(`${label}: duplicate species "${name}"`);
    seenSpecies.add(name);
  }
  if (table.values.length !== table.sites.length) {
    throw new TableError(`${label}: ${table.values.length} rows of values for ${table.sites.length} sites`);
  }
  table.values.forEach((row, i) => {
    if (row.length !== table.species.length) {
      throw new TableError(`${label}: site "${table.sites[i]}" has ${row.length} values for ${table.species.length} species`);
    }
    for (let j = 0; j < row.length; j++) {
      const v = row[j]!;
      if (!Number.isFinite(v) || v < 0) {
        throw new TableError(`${label}: site "${table.sites[i]}", species "${table.species[j]}": value ${v} is not a non-negative number`);
      }
    }
  });
}

/**
 * A table from (site, species, value) rows, e.g. season totals loaded from the database.
 * `sites` lists sites surveyed without any record, so they are reported as empty rather
 * than as missing from a season.
 */
export function tableFromRecords(
  records: Iterable<SpeciesRecord>,
  extra: { sites?: Iterable<string>; species?: Iterable<string> } = {},
): SpeciesTable {
  const siteIndex = new Map<string, number>();
  const speciesIndex = new Map<string, number>();
  const add = (map: Map<string, number>, key: string) => {
    if (!map.has(key)) map.set(key, map.size);
  };
  for (const s of extra.sites ?? []) add(siteIndex, s);
  for (const s of extra.species ?? []) add(speciesIndex, s);
  const list = [...records];
  for (const r of list) {
    add(siteIndex, r.site);
    add(speciesIndex, r.species);
  }
  const values = Array.from(siteIndex, () => new Float64Array(speciesIndex.size));
  const seen = new Set<string>();
  for (const r of list) {
    const key = JSON.stringify([r.site, r.species]);
    if (seen.has(key)) throw new TableError(`duplicate record for site "${r.site}", species "${r.species}"`);
    seen.add(key);
    values[siteIndex.get(r.site)!]![speciesIndex.get(r.species)!] = r.value;
  }
  const table = { sites: [...siteIndex.keys()], species: [...speciesIndex.keys()], values };
  validateTable(table, "records");
  return table;
}

/**
 * Keeps only the listed species (a species tag), for a loss-gain analysis of a subset.
 * Listed species absent from the table are simply zero, so they are left out.
 */
export function restrictToSpecies(table: SpeciesTable, species: Iterable<string>): SpeciesTable {
  const wanted = new Set(species);
  const keep: number[] = [];
  table.species.forEach((name, j) => {
    if (wanted.has(name)) keep.push(j);
  });
  return {
    sites: [...table.sites],
    species: keep.map((j) => table.species[j]!),
    values: table.values.map((row) => Float64Array.from(keep, (j) => row[j]!)),
  };
}

/**
 * Aligns the two seasons for one index: species matched by name (missing = 0), sites kept
 * when present in both tables and non-empty in at least one; the others are excluded with
 * their reason. Presence-absence indices see values > 0 as 1.
 */
export function preparePair(before: SpeciesTable, after: SpeciesTable, index: IndexName): PreparedPair {
  validateTable(before, "baseline table (T1)");
  validateTable(after, "comparison table (T2)");
  const presence = isPresenceAbsence(index);

  const species: string[] = [...before.species];
  const unionIndex = new Map(species.map((s, j) => [s, j]));
  for (const s of after.species) {
    if (!unionIndex.has(s)) {
      unionIndex.set(s, species.length);
      species.push(s);
    }
  }
  const p = species.length;
  const beforeCols = before.species.map((s) => unionIndex.get(s)!);
  const afterCols = after.species.map((s) => unionIndex.get(s)!);
  const afterRow = new Map(after.sites.map((s, i) => [s, i]));
  const beforeSites = new Set(before.sites);

  const sites: string[] = [];
  const rows1: Float64Array[] = [];
  const rows2: Float64Array[] = [];
  const excluded: ExcludedSite[] = [];
  before.sites.forEach((site, i) => {
    const k = afterRow.get(site);
    if (k === undefined) {
      excluded.push({ site, reason: REASON_ONLY_BEFORE });
      return;
    }
    const y1 = new Float64Array(p);
    const y2 = new Float64Array(p);
    const src1 = before.values[i]!;
    const src2 = after.values[k]!;
    beforeCols.forEach((col, j) => (y1[col] = presence ? (src1[j]! > 0 ? 1 : 0) : src1[j]!));
    afterCols.forEach((col, j) => (y2[col] = presence ? (src2[j]! > 0 ? 1 : 0) : src2[j]!));
    if (!y1.some((v) => v > 0) && !y2.some((v) => v > 0)) {
      excluded.push({ site, reason: REASON_EMPTY });
      return;
    }
    sites.push(site);
    rows1.push(y1);
    rows2.push(y2);
  });
  for (const site of after.sites) {
    if (!beforeSites.has(site)) excluded.push({ site, reason: REASON_ONLY_AFTER });
  }

  // Per-species cell lists: count, prefix-sum, fill (sites ascend within a species).
  const n = sites.length;
  const colStart = new Int32Array(p + 1);
  for (let i = 0; i < n; i++) {
    const y1 = rows1[i]!;
    const y2 = rows2[i]!;
    for (let j = 0; j < p; j++) if (y1[j]! > 0 || y2[j]! > 0) colStart[j + 1]!++;
  }
  for (let j = 0; j < p; j++) colStart[j + 1] = colStart[j + 1]! + colStart[j]!;
  const cells = colStart[p]!;
  const cellSite = new Int32Array(cells);
  const v1 = new Float64Array(cells);
  const v2 = new Float64Array(cells);
  const fill = colStart.slice(0, p);
  for (let i = 0; i < n; i++) {
    const y1 = rows1[i]!;
    const y2 = rows2[i]!;
    for (let j = 0; j < p; j++) {
      if (y1[j]! > 0 || y2[j]! > 0) {
        const c = fill[j]!++;
        cellSite[c] = i;
        v1[c] = y1[j]!;
        v2[c] = y2[j]!;
      }
    }
  }
  return { index, sites, species, excluded, colStart, cellSite, before: v1, after: v2 };
}
