// How a walk reached Turnstone, in words, wherever walks are listed: typed in from a paper sheet
// by a reviewer or organiser, or imported from an earlier season's file. Pure, for any screen.

export type WalkSource = { enteredBy: string | null; importedFrom: string | null };

/** "recorded by Sam Okonjo, entered by Priya Coldharbour", "imported from walks-2019.csv on 2026-03-02", or null for a walk sent from the phone. */
export function walkSourceText(source: WalkSource & { recorder?: string | null }): string | null {
  if (source.importedFrom) return source.importedFrom;
  if (source.enteredBy) return source.recorder ? `recorded by ${source.recorder}, entered by ${source.enteredBy}` : `entered by ${source.enteredBy}`;
  return null;
}
