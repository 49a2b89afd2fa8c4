import { sql } from "drizzle-orm";
import { boolean, check, index, integer, pgEnum, pgTable, primaryKey, smallint, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";

export const taxonRankEnum = pgEnum("taxon_rank", ["species", "subspecies", "species_aggregate", "genus", "family", "other"]);

export const species = pgTable(
  "species",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    scientificName: text("scientific_name").notNull(),
    vernacularName: text("vernacular_name").notNull(),
    taxonRank: taxonRankEnum("taxon_rank").notNull().default("species"),
    taxonGroup: text("taxon_group").notNull(),
    // Sensitive species have their positions withheld from volunteers and partners.
    sensitive: boolean("sensitive").notNull().default(false),
    // Usual months of activity (1-12); a record outside them is flagged for review.
    activeMonths: smallint("active_months").array().notNull().default(sql`'{}'::smallint[]`),
    sortOrder: integer("sort_order").notNull().default(0),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("species_scientific_name_idx").on(sql`lower(${t.scientificName})`),
    index("species_vernacular_idx").on(t.vernacularName),
    check("species_active_months_range", sql`${t.activeMonths} <@ '{1,2,3,4,5,6,7,8,9,10,11,12}'::smallint[]`),
  ],
);

export const speciesTags = pgTable(
  "species_tags",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    slug: text("slug").notNull().unique(),
    label: text("label").notNull(),
    description: text("description"),
  },
  // Imports name tags by label or slug, so a label is one tag's only, in any letter case.
  (t) => [uniqueIndex("species_tags_label_idx").on(sql`lower(${t.label})`)],
);

export const speciesTagLinks = pgTable(
  "species_tag_links",
  {
    speciesId: uuid("species_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    tagId: uuid("tag_id").notNull().references(() => speciesTags.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.speciesId, t.tagId] }), index("species_tag_links_tag_idx").on(t.tagId)],
);

/**
 * Other names an entry is known by (older or alternative scientific names). A name is one entry's
 * only: unique here in any letter case, and never another entry's scientific name (checked by the
 * checklist's writes, which hold the checklist lock: lib/queries/checklist-lock.ts).
 */
export const speciesSynonyms = pgTable(
  "species_synonyms",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    speciesId: uuid("species_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    name: text("name").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("species_synonyms_name_idx").on(sql`lower(${t.name})`), index("species_synonyms_species_idx").on(t.speciesId)],
);

/**
 * The species an aggregate (rank species_aggregate: similar species often left at the pair, such as
 * two skippers told apart only in the hand) stands for.
 */
export const speciesAggregateMembers = pgTable(
  "species_aggregate_members",
  {
    aggregateId: uuid("aggregate_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    memberId: uuid("member_id").notNull().references(() => species.id, { onDelete: "cascade" }),
  },
  (t) => [
    primaryKey({ columns: [t.aggregateId, t.memberId] }),
    index("species_aggregate_members_member_idx").on(t.memberId),
    check("species_aggregate_members_distinct", sql`${t.aggregateId} <> ${t.memberId}`),
  ],
);

/**
 * Entries folded into another by a merge. The folded row is gone; its id stays here so that a
 * phone still holding it (an unsent sighting, an old copy of the checklist) can be re-pointed.
 */
export const speciesMerges = pgTable(
  "species_merges",
  {
    fromSpeciesId: uuid("from_species_id").primaryKey(),
    fromScientificName: text("from_scientific_name").notNull(),
    intoSpeciesId: uuid("into_species_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    mergedAt: timestamp("merged_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("species_merges_into_idx").on(t.intoSpeciesId)],
);
