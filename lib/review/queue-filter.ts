import { z } from "zod";
import { sightingStatusEnum } from "@/db/schema/field";
import { warningFilters } from "./warnings";

// The review queue's filters, sorting and paging: the page's URL and GET /api/review/sightings
// take the same parameters (so a view can be bookmarked or shared), parsed by this one schema.
// Every filter is optional; values that do not parse are a 400 with the field named.

export const QUEUE_PAGE_SIZES = [25, 50, 100] as const;
export const DEFAULT_PAGE_SIZE = 50;
/** The most sightings one bulk action takes; more asks the reviewer to narrow the filter. */
export const BULK_LIMIT = 5_000;

/** "waiting" is every sighting still to decide (waiting for review or with a question asked); "answered" those whose question was answered. */
export const statusFilters = ["waiting", ...sightingStatusEnum.enumValues, "answered", "any"] as const;
export type StatusFilter = (typeof statusFilters)[number];

export const queueSorts = ["date", "species", "transect", "volunteer", "count", "status"] as const;
export type QueueSort = (typeof queueSorts)[number];

const isoDate = z.iso.date({ error: "Use a date such as 2026-06-14" });

export const queueFilterSchema = z
  .object({
    status: z.enum(statusFilters).default("waiting"),
    season: z.uuid().optional(),
    transect: z.uuid().optional(),
    habitat: z.uuid().optional(),
    species: z.uuid().optional(),
    volunteer: z.uuid().optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    warning: z.enum(warningFilters).optional(),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, { path: ["to"], message: "The end date is before the start date" });

export type QueueFilter = z.infer<typeof queueFilterSchema>;

export const queueQuerySchema = z.intersection(
  queueFilterSchema,
  z.object({
    sort: z.enum(queueSorts).default("date"),
    dir: z.enum(["asc", "desc"]).default("desc"),
    page: z.coerce.number().int().min(1).max(100_000).default(1),
    pageSize: z.coerce
      .number()
      .int()
      .refine((n) => (QUEUE_PAGE_SIZES as readonly number[]).includes(n), { message: `Choose ${QUEUE_PAGE_SIZES.join(", ")} a page` })
      .default(DEFAULT_PAGE_SIZE),
  }),
);
export type QueueQuery = z.infer<typeof queueQuerySchema>;

/** The filters as URL search parameters, defaults left out, in a stable order. */
export function queueSearchParams(q: Partial<QueueQuery>): URLSearchParams {
  const out = new URLSearchParams();
  const defaults: Partial<Record<keyof QueueQuery, unknown>> = { status: "waiting", sort: "date", dir: "desc", page: 1, pageSize: DEFAULT_PAGE_SIZE };
  for (const key of ["status", "season", "transect", "habitat", "species", "volunteer", "from", "to", "warning", "sort", "dir", "page", "pageSize"] as const) {
    const value = q[key];
    if (value === undefined || value === null || value === "" || defaults[key] === value) continue;
    out.set(key, String(value));
  }
  return out;
}
