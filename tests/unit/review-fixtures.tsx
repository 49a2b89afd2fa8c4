import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { expect, vi } from "vitest";
import { ReviewQueue } from "@/components/review/queue/review-queue";
import type { QueueOptions, QueuePage, QueueRow, SightingDetail, SpeciesChoice } from "@/lib/review/contract";

// The review queue's component tests: an invented network's sightings and a fake review API on
// fetch (recording every call). next/navigation's fake is in review-navigation.ts.

export { navigation } from "./review-navigation";

export const ids = {
  seasonNow: "5e450001-0000-4000-8000-000000000001",
  seasonBefore: "5e450001-0000-4000-8000-000000000002",
  transectDown: "7a000001-0000-4000-8000-000000000001",
  transectMarsh: "7a000001-0000-4000-8000-000000000002",
  habitat: "4ab00001-0000-4000-8000-000000000001",
  volunteerAsha: "0f000001-0000-4000-8000-000000000001",
  volunteerBen: "0f000001-0000-4000-8000-000000000002",
  walkOne: "3a000001-0000-4000-8000-000000000001",
  walkTwo: "3a000001-0000-4000-8000-000000000002",
  speciesBlue: "5b000001-0000-4000-8000-000000000001",
  speciesCopper: "5b000001-0000-4000-8000-000000000002",
  speciesWhite: "5b000001-0000-4000-8000-000000000003",
  speciesSkipper: "5b000001-0000-4000-8000-000000000004",
  aggregate: "5b000001-0000-4000-8000-000000000099",
};

const down = { id: ids.transectDown, code: "DWN-02", name: "Hollow Down" };
const marsh = { id: ids.transectMarsh, code: "MSH-01", name: "Reed Marsh" };

export function row(over: Partial<QueueRow> & { id: string }): QueueRow {
  return {
    revision: 1,
    status: "pending",
    answered: false,
    corrected: false,
    count: 1,
    section: 2,
    species: { id: ids.speciesWhite, vernacularName: "Marbled White", scientificName: "Melanargia galathea", aggregate: false },
    transect: down,
    walk: { id: ids.walkTwo, date: "2026-06-12", breaches: [], enteredBy: null, importedFrom: null },
    volunteer: { id: ids.volunteerBen, name: "Ben Carrow" },
    photoCount: 0,
    thumbnailUrl: null,
    warnings: [],
    tally: { entries: 1, sum: over.count ?? 1 },
    ...over,
  };
}

const blue = { id: ids.speciesBlue, vernacularName: "Chalkhill Blue", scientificName: "Lysandra coridon", aggregate: false };
const blueTally = (id: string, count: number, revision: number) =>
  row({ id, revision, count, section: 4, species: blue, transect: down, walk: { id: ids.walkOne, date: "2026-06-14", breaches: [], enteredBy: null, importedFrom: null }, volunteer: { id: ids.volunteerAsha, name: "Asha Penrose" }, tally: { entries: 3, sum: 12 } });

/** Five sightings, newest first: a tally of three, one with warnings on a windy walk, one plain with a photo. */
export const rows: QueueRow[] = [
  blueTally("50000000-0000-4000-8000-00000000000a", 2, 11),
  blueTally("50000000-0000-4000-8000-00000000000b", 5, 12),
  blueTally("50000000-0000-4000-8000-00000000000c", 5, 13),
  row({
    id: "50000000-0000-4000-8000-00000000000d",
    revision: 4,
    count: 30,
    species: { id: ids.speciesCopper, vernacularName: "Small Copper", scientificName: "Lycaena phlaeas", aggregate: false },
    transect: marsh,
    section: 1,
    walk: { id: "3a000001-0000-4000-8000-000000000003", date: "2026-06-13", breaches: ["too_windy"], enteredBy: "Priya Coldharbour", importedFrom: null },
    warnings: ["outside_months", "count_above_usual"],
  }),
  row({ id: "50000000-0000-4000-8000-00000000000e", revision: 7, photoCount: 2, thumbnailUrl: "https://photos.example.invalid/thumbnails/e.jpg" }),
  row({
    id: "50000000-0000-4000-8000-00000000000f",
    revision: 9,
    status: "queried",
    answered: true,
    corrected: true,
    species: { id: ids.speciesSkipper, vernacularName: "Essex Skipper", scientificName: "Thymelicus lineola", aggregate: false },
    walk: { id: ids.walkTwo, date: "2026-06-11", breaches: [], enteredBy: null, importedFrom: null },
  }),
];

export const byId = (id: string) => rows.find((r) => r.id.endsWith(id))!;

export function detailOf(r: QueueRow, over: Partial<SightingDetail> = {}): SightingDetail {
  return {
    ...r,
    note: null,
    position: { latitude: 51.02, longitude: -1.31, accuracyMetres: 8 },
    sensitive: false,
    photos: r.thumbnailUrl
      ? [
          { id: `${r.id}-p1`, thumbnailUrl: r.thumbnailUrl, displayUrl: "https://photos.example.invalid/display/e1.jpg", width: 1600, height: 1200 },
          { id: `${r.id}-p2`, thumbnailUrl: r.thumbnailUrl, displayUrl: "https://photos.example.invalid/display/e2.jpg", width: 1600, height: 1200 },
        ]
      : [],
    walkDetail: { startTime: "11:05:00", endTime: "12:10:00", temperatureC: 19, windBeaufort: 2, cloudCoverPercent: 30, sunshinePercent: 70, rain: "none", completeList: true, notes: null, breachTexts: r.walk.breaches.length ? ["Wind above force 5"] : [] },
    route: { line: { type: "LineString", coordinates: [[-1.32, 51.01], [-1.3, 51.03]] }, sectionCount: 6 },
    earlier: [{ seasonId: ids.seasonBefore, seasonName: "2025 season", sightings: 4, total: 9, maxCount: 3 }],
    history: [],
    canReopen: true,
    ...over,
  };
}

export const options: QueueOptions = {
  seasons: [
    { id: ids.seasonNow, name: "2026 season" },
    { id: ids.seasonBefore, name: "2025 season" },
  ],
  transects: [down, marsh],
  habitats: [{ id: ids.habitat, name: "Chalk grassland" }],
  volunteers: [
    { id: ids.volunteerAsha, name: "Asha Penrose" },
    { id: ids.volunteerBen, name: "Ben Carrow" },
  ],
};

export const speciesChoices: SpeciesChoice[] = [
  { id: ids.aggregate, vernacularName: "Small/Essex Skipper", scientificName: "Thymelicus sylvestris/lineola", aggregate: true, members: ["Small Skipper", "Essex Skipper"] },
  { id: ids.speciesSkipper, vernacularName: "Essex Skipper", scientificName: "Thymelicus lineola", aggregate: false, members: [] },
];

export type Call = { url: string; method: string; body: unknown };
type Answer = Response | object;
export type Api = {
  queue?: (url: URL, call: number) => Answer;
  detail?: (id: string, call: number) => Answer;
  action?: (id: string, body: Record<string, unknown>) => Answer;
  bulk?: (body: Record<string, unknown>) => Answer;
};

const page = (list: QueueRow[], over: Partial<QueuePage> = {}): QueuePage => ({ rows: list, total: list.length, page: 1, pageSize: 50, listedAt: "2026-06-15T08:00:00.000Z", ...over });
export { page };

/** The fake review API on fetch; every call is kept, in order. */
export function serveApi(api: Api = {}): Call[] {
  const calls: Call[] = [];
  const counts = new Map<string, number>();
  const next = (key: string) => {
    const n = (counts.get(key) ?? 0) + 1;
    counts.set(key, n);
    return n;
  };
  const json = (a: Answer) => (a instanceof Response ? a : Response.json(a));
  vi.stubGlobal(
    "fetch",
    vi.fn(async (input: string, init?: RequestInit) => {
      const url = new URL(input, "http://localhost");
      const method = init?.method ?? "GET";
      const body = init?.body ? JSON.parse(String(init.body)) : undefined;
      calls.push({ url: `${url.pathname}${url.search}`, method, body });
      const path = url.pathname;
      if (path === "/api/review/options") return json(options);
      if (path === "/api/review/species") {
        const q = (url.searchParams.get("q") ?? "").toLowerCase();
        return json({ species: speciesChoices.filter((s) => `${s.vernacularName} ${s.scientificName}`.toLowerCase().includes(q)) });
      }
      if (path === "/api/review/sightings") return json(api.queue?.(url, next("queue")) ?? page(rows));
      if (path === "/api/review/bulk") return json(api.bulk?.(body) ?? { done: 0, skipped: [] });
      const action = path.match(/^\/api\/review\/sightings\/([^/]+)\/actions$/);
      if (action) return json(api.action?.(action[1]!, body) ?? { row: { ...rows.find((r) => r.id === action[1])!, revision: 100 } });
      const detail = path.match(/^\/api\/review\/sightings\/([^/]+)$/);
      if (detail) {
        const id = detail[1]!;
        const n = next(`detail:${id}`);
        return json(api.detail?.(id, n) ?? detailOf(rows.find((r) => r.id === id)!));
      }
      return Response.json({ error: { code: "not_found", message: "No such route in the test." } }, { status: 404 });
    }),
  );
  return calls;
}

/** The queue at an address such as "/review?status=any", on a fresh cache. */
export async function renderQueue(address = "/review") {
  window.history.replaceState(null, "", address);
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: 30_000 } } });
  const view = render(
    <QueryClientProvider client={client}>
      <ReviewQueue tileUrl={null} />
    </QueryClientProvider>,
  );
  await screen.findByTestId("review-queue");
  return view;
}

export const queueCalls = (calls: Call[]) => calls.filter((c) => c.url.startsWith("/api/review/sightings") && c.method === "GET" && !/sightings\/[^?]/.test(c.url));
export const posts = (calls: Call[]) => calls.filter((c) => c.method === "POST");

/** Opens a sighting by its button in the list and waits for its panel. */
export async function openRow(name: RegExp | string) {
  fireEvent.click(screen.getAllByRole("button", { name })[0]!);
  await waitFor(() => expect(screen.getByTestId("sighting-detail")).toBeTruthy());
}
