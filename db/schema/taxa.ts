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

export const speciesTags = pgTable("species_tags", {
  id: uuid("id").primaryKey().defaultRandom(),
  slug: text("slug").notNull().unique(),
  label: text("label").notNull(),
  description: text("description"),
});

export const speciesTagLinks = pgTable(
  "species_tag_links",
  {
    speciesId: uuid("species_id").notNull().references(() => species.id, { onDelete: "cascade" }),
    tagId: uuid("tag_id").notNull().references(() => speciesTags.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.speciesId, t.tagId] }), index("species_tag_links_tag_idx").on(t.tagId)],
);
