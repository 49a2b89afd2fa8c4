// Species tags are named by people ("Grassland specialist") and found by slug
// ("grassland-specialist"); files may use either, in any letter case.

export type TagRef = { id: string; slug: string; label: string };

/** Lower case ASCII letters and digits joined by hyphens; accents are dropped ("Ëarly" → "early"). */
export function slugify(label: string): string {
  return label
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "");
}

/** The tag a name in a file or form means: by label, by slug, or by the slug the name would get. */
export function findTag<T extends TagRef>(tags: readonly T[], name: string): T | undefined {
  const lower = name.trim().toLowerCase();
  const slug = slugify(name);
  return tags.find((t) => t.label.toLowerCase() === lower || t.slug === lower || (slug !== "" && t.slug === slug));
}
