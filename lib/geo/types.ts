import type { LineString } from "@/db/schema/sites";

/** [longitude, latitude] in WGS84, as RFC 7946 §3.1.1 orders them. */
export type Position = [number, number];
export type { LineString };

/** A section as sent or read from a file: its own stretch of the route and its habitat. */
export type SectionDraft = { coordinates: Position[]; habitat?: string | null };

/** A route checked and measured: the whole line, and each section as a stretch of it. */
export type BuiltRoute = {
  route: LineString;
  lengthMetres: number;
  sections: { number: number; from: number; to: number; lengthMetres: number; habitat: string | null }[];
};

/** What a check found: a value with its warnings, or the reasons it was refused. */
export type Checked<T> = { ok: true; value: T; warnings: string[] } | { ok: false; errors: string[] };

export const refused = (...errors: string[]): { ok: false; errors: string[] } => ({ ok: false, errors });
