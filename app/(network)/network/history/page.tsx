import type { Metadata } from "next";
import Link from "next/link";
import { z } from "zod";
import { ChangeValues } from "@/components/network/change-values";
import { networkChanges } from "@/db/schema";
import { requirePageActor } from "@/lib/auth/guard";
import { listChanges } from "@/lib/queries/change-log";

export const metadata: Metadata = { title: "Network history" };

const query = z.object({
  entity: z.enum(networkChanges.entity.enumValues).optional().catch(undefined),
  id: z.string().max(100).optional().catch(undefined),
  after: z.string().max(200).optional().catch(undefined),
});

const entityLabel: Record<(typeof networkChanges.entity.enumValues)[number], string> = {
  transect: "Transects",
  habitat_group: "Habitat groups",
  species: "Checklist",
  species_tag: "Species tags",
  season: "Seasons",
  person: "People",
  assignment: "Assignments",
  agreement: "Recorder agreement",
  settings: "Settings",
  import: "Imports",
};

export default async function HistoryPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  await requirePageActor(["organiser"], "/network/history");
  const { entity, id, after } = query.parse(await searchParams);
  const page = await listChanges({ entity, entityId: id, after });
  const link = (params: Record<string, string | undefined>) => {
    const search = new URLSearchParams(Object.entries(params).filter((e): e is [string, string] => Boolean(e[1])));
    return `/network/history${search.size ? `?${search}` : ""}`;
  };
  return (
    <div className="space-y-4">
      <h1 className="text-2xl font-bold text-tideline-800">Network history</h1>
      <p className="text-shingle-700">Every change made to the network&apos;s set-up: who made it, when, and what it was before.</p>
      <nav aria-label="Filter the history" className="flex flex-wrap gap-2">
        <Link href={link({})} className={`btn-quiet ${entity ? "" : "ring-2 ring-tideline-600"}`}>Everything</Link>
        {Object.entries(entityLabel).map(([key, label]) => (
          <Link key={key} href={link({ entity: key })} className={`btn-quiet ${entity === key ? "ring-2 ring-tideline-600" : ""}`}>{label}</Link>
        ))}
      </nav>
      {page.rows.length === 0 ? (
        <p className="card">No changes recorded{entity ? " of this kind" : ""} yet.</p>
      ) : (
        <ol className="space-y-2">
          {page.rows.map((row) => (
            <li key={row.id} className="card">
              <p>
                <strong>{row.summary}</strong>
              </p>
              <p className="text-sm text-shingle-600">
                <time dateTime={row.at}>{new Date(row.at).toLocaleString("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" })} UTC</time> · {row.actorName ?? "someone no longer in the network"} · {entityLabel[row.entity]}
              </p>
              <ChangeValues before={row.before} after={row.after} />
            </li>
          ))}
        </ol>
      )}
      {page.next && <Link href={link({ entity, id, after: page.next })} className="btn-quiet">Older changes</Link>}
    </div>
  );
}
