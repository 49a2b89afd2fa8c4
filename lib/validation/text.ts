// Free text that PostgreSQL will store and every screen can show. zod-free, so the phone's
// bundle can use the same check as the server (see ./fields.ts for the zod form).

export const TEXT_PROBLEMS = {
  control: "Must not contain control characters.",
  brokenCharacter: "Must not contain broken characters (an unpaired UTF-16 surrogate).",
} as const;

// C0 controls except tab, line feed and carriage return (notes have several lines), DEL, and
// the C1 controls. NUL is the one PostgreSQL refuses outright in text; the rest are invisible
// and only reach us by corruption or mis-decoding.
const CONTROL_CHARACTER = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F]/;
// A high surrogate not followed by a low one, or a low one not preceded by a high one: such a
// string has no UTF-8 form, so PostgreSQL refuses it.
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

export function hasControlCharacter(text: string): boolean {
  return CONTROL_CHARACTER.test(text);
}

export function hasLoneSurrogate(text: string): boolean {
  return LONE_SURROGATE.test(text);
}

/** The problems that make this text unsafe to store, as messages for the field (empty when safe). */
export function unsafeTextProblems(text: string): string[] {
  const problems: string[] = [];
  if (hasControlCharacter(text)) problems.push(TEXT_PROBLEMS.control);
  if (hasLoneSurrogate(text)) problems.push(TEXT_PROBLEMS.brokenCharacter);
  return problems;
}
