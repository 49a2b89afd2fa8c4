import { describe, expect, it } from "vitest";
import { z } from "zod";
import { safeText } from "@/lib/validation/fields";
import { hasControlCharacter, hasLoneSurrogate, TEXT_PROBLEMS, unsafeTextProblems } from "@/lib/validation/text";

const messagesOf = (schema: z.ZodType, value: unknown) => {
  const parsed = schema.safeParse(value);
  return parsed.success ? [] : parsed.error.issues.map((i) => i.message);
};

describe("safe text", () => {
  it("refuses NUL, the other C0 controls, DEL and the C1 controls", () => {
    // Code points from the Unicode standard's Cc (control) category: U+0000-U+001F and U+007F-U+009F.
    for (const code of [0x00, 0x01, 0x08, 0x0b, 0x0c, 0x0e, 0x1b, 0x1f, 0x7f, 0x80, 0x85, 0x9f]) {
      expect(hasControlCharacter(`a${String.fromCharCode(code)}b`), `U+${code.toString(16).padStart(4, "0")}`).toBe(true);
    }
  });

  it("keeps tab, line breaks and ordinary letters, including characters outside the BMP", () => {
    expect(unsafeTextProblems("Line one\nline two\r\n\tindented")).toEqual([]);
    expect(unsafeTextProblems("Café, Ærø, Zürich, 30\u00a0°C, \u{1F98B} on the bramble")).toEqual([]);
  });

  it("finds unpaired UTF-16 surrogates wherever they are, but not a proper pair", () => {
    const butterfly = "\u{1F98B}"; // stored as the pair \uD83E\uDD8B
    expect(hasLoneSurrogate(butterfly)).toBe(false);
    expect(hasLoneSurrogate("\uD83E")).toBe(true);
    expect(hasLoneSurrogate("end \uD83E")).toBe(true);
    expect(hasLoneSurrogate("\uDD8B start")).toBe(true);
    expect(hasLoneSurrogate("\uDD8B\uD83E")).toBe(true); // the pair's halves in the wrong order
    expect(hasLoneSurrogate(`${butterfly}\uD83E${butterfly}`)).toBe(true);
  });

  it("as a zod field: trims, limits the length and gives one clear message per problem", () => {
    const field = safeText(10);
    expect(field.parse("  Robin  ")).toBe("Robin");
    expect(messagesOf(field, "x".repeat(11))).toEqual(["At most 10 characters."]);
    expect(messagesOf(field, "nul\u0000")).toEqual([TEXT_PROBLEMS.control]);
    expect(messagesOf(field, "half \uD800")).toEqual([TEXT_PROBLEMS.brokenCharacter]);
    expect(messagesOf(field, "\u0000\uDC00")).toEqual([TEXT_PROBLEMS.control, TEXT_PROBLEMS.brokenCharacter]);
    expect(messagesOf(safeText(10, z.string({ message: "Write something." })), 42)).toEqual(["Write something."]);
  });
});
