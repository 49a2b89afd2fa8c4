import { sql } from "drizzle-orm";
import { boolean, check, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { ALPHA, PERMUTATIONS } from "../../lib/limits/analysis";
import { literal } from "./check-sql";
import { users } from "./people";
import { seasons, transects } from "./sites";
import { speciesTags } from "./taxa";

export const dissimilarityIndexEnum = pgEnum("dissimilarity_index", ["jaccard", "sorensen", "ruzicka", "percentage-difference"]);
export const permutationModeEnum = pgEnum("permutation_mode", ["paired", "independent"]);
export const pAdjustEnum = pgEnum("p_adjust", ["holm", "bh", "bonferroni", "none"]);
export const abundanceSummaryEnum = pgEnum("abundance_summary", ["sum", "max", "mean"]);
export const effortMatchingEnum = pgEnum("effort_matching", ["none", "random-subsample", "earliest"]);
export const runStatusEnum = pgEnum("run_status", ["queued", "running", "finished", "failed", "cancelled"]);
export const directionEnum = pgEnum("change_direction", ["gain", "loss", "none"]);

/** One comparison of two seasons with every setting that shaped it, so any result can be reproduced. */
export const analysisRuns = pgTable(
  "analysis_runs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    requestedById: uuid("requested_by_id").references(() => users.id, { onDelete: "set null" }),
    baselineSeasonId: uuid("baseline_season_id").notNull().references(() => seasons.id, { onDelete: "restrict" }),
    comparisonSeasonId: uuid("comparison_season_id").notNull().references(() => seasons.id, { onDelete: "restrict" }),
    dissimilarityIndex: dissimilarityIndexEnum("dissimilarity_index").notNull().default("percentage-difference"),
    mode: permutationModeEnum("mode").notNull().default("paired"),
    permutations: integer("permutations").notNull().default(PERMUTATIONS.default),
    seed: integer("seed").notNull().default(1),
    adjust: pAdjustEnum("adjust").notNull().default("holm"),
    alpha: doublePrecision("alpha").notNull().default(ALPHA.default),
    abundanceSummary: abundanceSummaryEnum("abundance_summary").notNull().default("sum"),
    minVisits: integer("min_visits").notNull().default(1),
    effortMatching: effortMatchingEnum("effort_matching").notNull().default("none"),
    speciesTagId: uuid("species_tag_id").references(() => speciesTags.id, { onDelete: "set null" }),
    nightly: boolean("nightly").notNull().default(false),
    status: runStatusEnum("status").notNull().default("queued"),
    chunksTotal: integer("chunks_total").notNull().default(0),
    chunksDone: integer("chunks_done").notNull().default(0),
    // Overall summary, paired test and loss-gain plot geometry, as the engine returns them.
    summary: jsonb("summary"),
    failureReason: text("failure_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp("started_at", { withTimezone: true }),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    index("analysis_runs_seasons_idx").on(t.baselineSeasonId, t.comparisonSeasonId, t.createdAt),
    check("analysis_runs_distinct_seasons", sql`${t.baselineSeasonId} <> ${t.comparisonSeasonId}`),
    check("analysis_runs_permutations", sql`${t.permutations} between ${literal(PERMUTATIONS.min)} and ${literal(PERMUTATIONS.max)}`),
    check("analysis_runs_alpha", sql`${t.alpha} > ${literal(ALPHA.above)} and ${t.alpha} < ${literal(ALPHA.below)}`),
    check("analysis_runs_min_visits", sql`${t.minVisits} >= 1`),
  ],
);

/** Per-transect outcome of a run. */
export const analysisSiteResults = pgTable(
  "analysis_site_results",
  {
    runId: uuid("run_id").notNull().references(() => analysisRuns.id, { onDelete: "cascade" }),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "cascade" }),
    shared: doublePrecision("shared").notNull(),
    lost: doublePrecision("lost").notNull(),
    gained: doublePrecision("gained").notNull(),
    losses: doublePrecision("losses").notNull(),
    gains: doublePrecision("gains").notNull(),
    dissimilarity: doublePrecision("dissimilarity").notNull(),
    direction: directionEnum("direction").notNull(),
    p: doublePrecision("p"),
    pAdjusted: doublePrecision("p_adjusted"),
    exceptional: boolean("exceptional").notNull().default(false),
    speciesLost: jsonb("species_lost").$type<string[]>().notNull().default(sql`'[]'::jsonb`),
    speciesGained: jsonb("species_gained").$type<string[]>().notNull().default(sql`'[]'::jsonb`),
  },
  (t) => [
    primaryKey({ columns: [t.runId, t.transectId] }),
    check("analysis_site_results_d_range", sql`${t.dissimilarity} between 0 and 1`),
    check("analysis_site_results_p_range", sql`${t.p} is null or (${t.p} > 0 and ${t.p} <= 1)`),
  ],
);

/** Transects a run could not compare, with the reason shown to the organiser. */
export const analysisExclusions = pgTable(
  "analysis_exclusions",
  {
    runId: uuid("run_id").notNull().references(() => analysisRuns.id, { onDelete: "cascade" }),
    transectId: uuid("transect_id").notNull().references(() => transects.id, { onDelete: "cascade" }),
    reason: text("reason").notNull(),
  },
  (t) => [primaryKey({ columns: [t.runId, t.transectId] })],
);

/** Exceedance counts of one chunk of permutations; chunks add up to the run's p-values. */
export const analysisChunks = pgTable(
  "analysis_chunks",
  {
    runId: uuid("run_id").notNull().references(() => analysisRuns.id, { onDelete: "cascade" }),
    chunkIndex: integer("chunk_index").notNull(),
    permutations: integer("permutations").notNull(),
    counts: jsonb("counts").$type<number[]>(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [primaryKey({ columns: [t.runId, t.chunkIndex] })],
);
