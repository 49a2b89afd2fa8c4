import type { RecordCorrection, RecordDecision } from "@/lib/offline/records-copy";
import { CORRECTED, REVIEWER_TITLE } from "@/lib/review/words";

const day = (iso: string) => new Date(iso).toLocaleDateString(undefined, { dateStyle: "medium" });

/** One correction in words: what the sighting was and what it is now. */
export function correctionText(c: RecordCorrection): string {
  const species = c.fromName || c.toName ? `${c.fromName ?? "another species"} to ${c.toName ?? "another species"}` : null;
  const count = c.fromCount !== null || c.toCount !== null ? `${c.fromCount ?? "?"} to ${c.toCount ?? "?"}` : null;
  if (species && count) return `Corrected from ${species}, count from ${count}`;
  if (species) return `Corrected from ${species}`;
  if (count) return `Count corrected from ${count}`;
  return CORRECTED;
}

/**
 * What review made of one sighting besides its status and questions: why it is not used in
 * counts, the reviewer's note with the decision, and each correction with the old and new values.
 */
export function RecordOutcome({ decision, corrections }: { decision: RecordDecision | null; corrections: RecordCorrection[] }) {
  if (!decision?.reasonText && !decision?.note && corrections.length === 0) return null;
  return (
    <div className="mt-1 space-y-1 text-sm" data-testid="sighting-outcome">
      {decision?.action === "reject" && decision.reasonText && <p><strong>Why:</strong> {decision.reasonText}</p>}
      {decision?.note && <p><strong>{`${REVIEWER_TITLE}'s note:`}</strong> {decision.note}</p>}
      {corrections.length > 0 && (
        <ul className="space-y-1" aria-label="Corrections">
          {corrections.map((c, i) => (
            <li key={i}>
              {correctionText(c)} <span className="text-shingle-600">({day(c.at)})</span>
              {c.note && <>: {c.note}</>}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
