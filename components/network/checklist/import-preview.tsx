import { formatMonths } from "@/lib/checklist/months";
import type { EntryField, EntryValues, ImportPlan } from "@/lib/checklist/plan";
import { rankLabel } from "@/lib/checklist/ranks";

const fieldLabel: Record<EntryField, string> = {
  scientificName: "Scientific name",
  vernacularName: "Vernacular name",
  taxonRank: "Rank",
  sensitive: "Sensitive",
  activeMonths: "Usual months",
  tags: "Tags",
  synonyms: "Synonyms",
  covers: "Covers",
};

function show(field: EntryField, value: EntryValues[EntryField]): string {
  if (field === "activeMonths") return formatMonths(value as number[]) || "none";
  if (field === "taxonRank") return rankLabel[value as EntryValues["taxonRank"]];
  if (field === "sensitive") return value ? "yes" : "no";
  if (Array.isArray(value)) return value.length ? value.join(", ") : "none";
  return String(value);
}

const statusLabel = { new: "New", changed: "Changed", unchanged: "Unchanged" } as const;

/** What an import would do, entry by entry: new ones, changed ones with each field before and after. */
export function ImportPreview({ plan, showUnchanged }: { plan: ImportPlan; showUnchanged: boolean }) {
  const rows = plan.entries.filter((e) => showUnchanged || e.status !== "unchanged");
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse bg-white text-sm">
        <caption className="sr-only">Entries in the file and what importing it would do to each</caption>
        <thead>
          <tr className="border-b border-shingle-200 text-left">
            <th scope="col" className="p-2">Line</th>
            <th scope="col" className="p-2">Entry</th>
            <th scope="col" className="p-2">What happens</th>
            <th scope="col" className="p-2">Details</th>
          </tr>
        </thead>
        <tbody>
          {rows.map((e) => (
            <tr key={e.line} className="border-b border-shingle-100 align-top">
              <td className="p-2 tabular-nums">{e.line}</td>
              <th scope="row" className="p-2 text-left font-normal"><i>{e.values.scientificName}</i> ({e.values.vernacularName})</th>
              <td className="p-2 font-bold">{statusLabel[e.status]}</td>
              <td className="p-2">
                {e.status === "new" && (
                  <span>
                    {rankLabel[e.values.taxonRank]}
                    {e.values.activeMonths.length > 0 && `, ${formatMonths(e.values.activeMonths)}`}
                    {e.values.tags.length > 0 && `; tags: ${e.values.tags.join(", ")}`}
                    {e.values.synonyms.length > 0 && `; synonyms: ${e.values.synonyms.join(", ")}`}
                    {e.values.covers.length > 0 && `; covers: ${e.values.covers.join(", ")}`}
                    {e.values.sensitive && "; sensitive"}
                  </span>
                )}
                {e.changes.length > 0 && (
                  <dl className="grid grid-cols-[auto_1fr] gap-x-3">
                    {e.changes.map((c) => (
                      <div key={c.field} className="contents">
                        <dt className="font-bold">{fieldLabel[c.field]}</dt>
                        <dd>
                          <del className="text-rust-700">{show(c.field, c.before)}</del> → <ins className="text-tideline-800 no-underline">{show(c.field, c.after)}</ins>
                        </dd>
                      </div>
                    ))}
                  </dl>
                )}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
