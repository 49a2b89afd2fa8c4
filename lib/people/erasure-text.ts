// Text helpers for erasing a person (lib/queries/personal-data.ts). Pure, so they are unit-tested.

/** `text` as a literal inside a PostgreSQL regular expression (ARE; PostgreSQL docs 9.7.3). */
export function escapeRegex(text: string): string {
  return text.replace(/[\\^$.|?*+()[\]{}]/g, "\\$&");
}

/**
 * A PostgreSQL regular expression matching `text` as a whole: not inside a longer word, so
 * erasing "Ann Lee" leaves "Annabel Leeming" alone. Used with the 'gi' flags.
 */
export function wholePattern(text: string): string {
  return `(?<![[:alnum:]_])${escapeRegex(text)}(?![[:alnum:]_])`;
}

/** How `text` appears inside a JSON document's text (its string escapes, without the quotes). */
export function asJsonText(text: string): string {
  return JSON.stringify(text).slice(1, -1);
}

const SEPARATOR = /\s*(?:,|;|&|\/|\+|\n|\band\b)\s*/i;

/**
 * A walk's "walked with" line without one person's name: each listed person is kept unless it is
 * that name (any letter case, extra spaces ignored); what is left is joined with commas, or null
 * when nobody is left.
 */
export function withoutName(list: string | null, name: string): string | null {
  if (list === null) return null;
  const target = name.trim().replace(/\s+/g, " ").toLowerCase();
  const kept = list
    .split(SEPARATOR)
    .map((p) => p.trim())
    .filter((p) => p !== "" && p.replace(/\s+/g, " ").toLowerCase() !== target);
  return kept.length ? kept.join(", ") : null;
}
