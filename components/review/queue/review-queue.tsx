"use client";

import { keepPreviousData, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useEffect, useRef, useState } from "react";
import type { Conflict, QueuePage, QueueRow, SightingDetail as Detail } from "@/lib/review/contract";
import { queueSearchParams, type QueueQuery } from "@/lib/review/queue-filter";
import { ChangedError, fetchQueue, fetchSighting, postAction, reviewKeys, type ActionOutcome } from "./api";
import { BulkBar, type BulkScope } from "./bulk-bar";
import { walkDate } from "./format";
import { HelpOverlay } from "./help-overlay";
import { PhotoViewer } from "./photo-viewer";
import { filterOf, useQueueUrl } from "./queue-url";
import { QueueFilters, statusFilterLabel } from "./queue-filters";
import { QueueTable, type Selection } from "./queue-table";
import type { ActionBody, Panel } from "./review-actions";
import { isUndecided, matchesStatus } from "./rows";
import { useShortcuts, type ShortcutAction } from "./shortcuts";
import { SightingDetail } from "./sighting-detail";
import { useWide } from "./use-wide";

const EMPTY: QueueRow[] = [];

const doneWords: Record<ActionBody["action"], string> = { accept: "Confirmed", query: "Question sent", reject: "Set aside", edit: "Corrected", reopen: "Reopened" };
/** After these the reviewer is done with the sighting and the next one opens; after a correction or a reopen it stays open. */
const moveOn = new Set<ActionBody["action"]>(["accept", "query", "reject"]);

const sortWords: Record<QueueQuery["sort"], string> = { date: "walk date", species: "species", transect: "transect", volunteer: "volunteer", count: "count", status: "status" };

/** The reviewers' queue: filters in the address, the table, the open sighting beside it, bulk actions and shortcuts. */
export function ReviewQueue({ tileUrl }: { tileUrl: string | null }) {
  const [{ query, ignored }, setQuery] = useQueueUrl();
  const search = queueSearchParams(query).toString();
  const filterKey = queueSearchParams(filterOf(query)).toString();
  const client = useQueryClient();
  const wide = useWide();

  const queue = useQuery({ queryKey: reviewKeys.queue(search), queryFn: () => fetchQueue(search), placeholderData: keepPreviousData });
  const page = queue.data;
  const rows = page?.rows ?? EMPTY;
  const total = page?.total ?? 0;

  const [currentId, setCurrentId] = useState<string | null>(null);
  const [panel, setPanel] = useState<Panel | null>(null);
  const [photo, setPhoto] = useState<number | null>(null);
  const [help, setHelp] = useState(false);
  const [changed, setChanged] = useState<Conflict | null>(null);
  const [confirmError, setConfirmError] = useState<unknown>(null);
  const [announcement, setAnnouncement] = useState("");
  // The selection belongs to the filter it was made under: another filter starts with none.
  const [picked, setPicked] = useState<{ filterKey: string; selection: Selection; allMatching: boolean }>({ filterKey, selection: {}, allMatching: false });
  const selection = picked.filterKey === filterKey ? picked.selection : {};
  const allMatching = picked.filterKey === filterKey && picked.allMatching;

  const rowButtons = useRef(new Map<string, HTMLButtonElement>());
  const heading = useRef<HTMLHeadingElement>(null);
  const focusWanted = useRef<string | null>(null);
  const register = useCallback((id: string, el: HTMLButtonElement | null) => {
    if (el) rowButtons.current.set(id, el);
    else rowButtons.current.delete(id);
  }, []);
  // Focus follows the open sighting once it is on screen: its row in the list, or (when the
  // sighting takes the whole screen) its heading.
  useEffect(() => {
    const id = focusWanted.current;
    if (!id) return;
    const target = wide ? rowButtons.current.get(id) : heading.current;
    if (target && (wide || heading.current?.closest("[data-sighting-id]")?.getAttribute("data-sighting-id") === id)) {
      target.focus();
      focusWanted.current = null;
    }
  });

  const open = useCallback((id: string | null, focus = false) => {
    setCurrentId(id);
    setPanel(null);
    setChanged(null);
    setConfirmError(null);
    focusWanted.current = focus ? id : null;
  }, []);

  const replaceRow = (row: QueueRow) => {
    client.setQueryData<QueuePage>(reviewKeys.queue(search), (old) => (old ? { ...old, rows: old.rows.map((r) => (r.id === row.id ? row : r)) } : old));
  };

  /** After a decision: the next sighting on this page still in the filter; at the page's end, the next ones. */
  const goOn = async (fromId: string, now: QueueRow[]) => {
    const at = now.findIndex((r) => r.id === fromId);
    const next = now.slice(at + 1).find((r) => matchesStatus(r, query.status));
    if (next) return open(next.id, true);
    // Decided sightings left the filter, so the same page now holds the next ones; otherwise turn the page.
    const anyLeft = now.some((r) => !matchesStatus(r, query.status));
    const lastPage = Math.max(1, Math.ceil(total / query.pageSize));
    const target = anyLeft ? query : query.page < lastPage ? { ...query, page: query.page + 1 } : null;
    if (!target) {
      setAnnouncement("That was the last sighting that matches the filter.");
      return;
    }
    const targetSearch = queueSearchParams(target).toString();
    try {
      const fresh = await client.fetchQuery({ queryKey: reviewKeys.queue(targetSearch), queryFn: () => fetchQueue(targetSearch), staleTime: 0 });
      if (target !== query) setQuery({ page: target.page });
      const first = fresh.rows.find((r) => matchesStatus(r, query.status));
      if (first) open(first.id, true);
      else setAnnouncement("Nothing more matches the filter.");
    } catch {
      setAnnouncement("The next sightings could not be loaded; use the page buttons to try again.");
    }
  };

  const act = useMutation({ mutationFn: ({ id, input }: { id: string; input: Parameters<typeof postAction>[1] }) => postAction(id, input) });

  const runOn = (row: QueueRow) => async (body: ActionBody) => {
    setChanged(null);
    setConfirmError(null);
    const outcome: ActionOutcome = await act.mutateAsync({ id: row.id, input: { ...body, revision: row.revision } as Parameters<typeof postAction>[1] });
    void client.invalidateQueries({ queryKey: reviewKeys.sighting(row.id) });
    if (outcome.kind === "changed") {
      replaceRow(outcome.conflict.row);
      setChanged(outcome.conflict);
      setAnnouncement(`${outcome.conflict.error.changedBy ?? "Someone"} changed this sighting first; it has been refreshed.`);
      throw new ChangedError(outcome.conflict);
    }
    // Other pages may have shifted; this one stays as it is until the reviewer moves on.
    void client.invalidateQueries({ queryKey: reviewKeys.queues, refetchType: "none" });
    replaceRow(outcome.row);
    setAnnouncement(`${doneWords[body.action]}: ${row.species.vernacularName}, ${walkDate(row.walk.date)}.`);
    if (moveOn.has(body.action)) {
      setPanel(null);
      await goOn(row.id, rows.map((r) => (r.id === row.id ? outcome.row : r)));
    } else {
      // A correction or a reopen leaves the sighting open, ready for the decision that usually follows.
      requestAnimationFrame(() => heading.current?.focus());
    }
  };

  // The same query as the open sighting's panel (one request): its photos, and the sighting itself when it is not on this page.
  const detail = useQuery({ queryKey: reviewKeys.sighting(currentId ?? ""), queryFn: () => fetchSighting(currentId!), enabled: currentId !== null });
  const shown: Detail | undefined = currentId && detail.data?.id === currentId ? detail.data : undefined;
  const current: QueueRow | null = (currentId ? rows.find((r) => r.id === currentId) : undefined) ?? shown ?? null;
  const confirm = () => {
    if (!current || !isUndecided(current) || act.isPending) return;
    runOn(current)({ action: "accept" }).catch((e: unknown) => setConfirmError(e));
  };

  useShortcuts((action: ShortcutAction) => {
    const at = rows.findIndex((r) => r.id === currentId);
    switch (action) {
      case "next":
      case "previous": {
        if (rows.length === 0) return false;
        const to = at === -1 ? 0 : Math.min(Math.max(at + (action === "next" ? 1 : -1), 0), rows.length - 1);
        open(rows[to]!.id, true);
        if (to === at) setAnnouncement(action === "next" ? "This is the last sighting on this page." : "This is the first sighting on this page.");
        return;
      }
      case "help":
        return setHelp(true);
      case "confirm":
        if (!current) return false;
        if (!isUndecided(current)) return setAnnouncement("This sighting is already decided; reopen it first to decide again.");
        return confirm();
      case "question":
      case "setAside":
        if (!current) return false;
        if (!isUndecided(current)) return setAnnouncement("This sighting is already decided; reopen it first to decide again.");
        return setPanel(action === "question" ? "query" : "reject");
      case "photo": {
        if (!currentId) return false;
        const d = shown;
        if (!d) return setAnnouncement("The photos are still loading.");
        if (d.photos.length === 0) return setAnnouncement("This sighting has no photo.");
        return setPhoto(0);
      }
    }
  });

  const describe = (id: string) => {
    for (const [, data] of client.getQueriesData<QueuePage>({ queryKey: reviewKeys.queues })) {
      const r = data?.rows.find((x) => x.id === id);
      if (r) return `${r.species.vernacularName}, ${walkDate(r.walk.date)}, ${r.volunteer.name}`;
    }
    return null;
  };
  const scope: BulkScope = allMatching && page ? { kind: "filter", filter: filterOf(query), listedAt: page.listedAt, total } : { kind: "ids", selection };
  const allPageSelected = rows.length > 0 && rows.every((r) => r.id in selection);
  const speciesShown = query.species ? (rows.find((r) => r.species.id === query.species)?.species ?? null) : null;
  const detailForPhoto = photo !== null ? shown : undefined;
  const pages = Math.max(1, Math.ceil(total / query.pageSize));

  return (
    // Wider than the page's usual column, so that the list and the open sighting sit side by side.
    <div className="space-y-4 lg:mx-[calc((100%-min(100vw-3rem,110rem))/2)]">
      <p className="sr-only" role="status" aria-live="polite" data-testid="review-announcement">{announcement}</p>
      <div className={currentId ? "hidden lg:block" : undefined}>
        <QueueFilters query={query} onChange={setQuery} speciesShown={speciesShown} />
        {ignored.length > 0 && <p className="mt-2 rounded-lg bg-sand-100 p-2 text-sand-800">Part of this address was not understood and is left out: {ignored.join(", ")}.</p>}
      </div>
      <div className="lg:grid lg:grid-cols-[minmax(0,3fr)_minmax(0,2fr)] lg:gap-4">
        <section aria-label="Sightings" className={`space-y-3 ${currentId ? "hidden lg:block" : ""}`}>
          <div className="flex flex-wrap items-center gap-2">
            <p className="text-shingle-700">
              {page ? `${total.toLocaleString("en-GB")} ${total === 1 ? "sighting" : "sightings"}: ${statusFilterLabel[query.status].toLowerCase()}` : ""}
              {queue.isFetching && page && <span className="ml-2 text-sm text-shingle-600">Updating…</span>}
            </p>
            <button type="button" className="btn-quiet ml-auto" onClick={() => setHelp(true)} aria-keyshortcuts="?">Keyboard shortcuts</button>
          </div>
          <BulkBar
            scope={scope}
            pageCount={rows.length}
            allPageSelected={allPageSelected}
            total={total}
            onSelectAllMatching={() => setPicked({ filterKey, selection, allMatching: true })}
            onClear={() => setPicked({ filterKey, selection: {}, allMatching: false })}
            onDone={() => {
              setPicked({ filterKey, selection: {}, allMatching: false });
              void client.invalidateQueries({ queryKey: reviewKeys.all });
            }}
            describe={describe}
          />
          {queue.isError && (
            <div role="alert" className="card border-rust-700">
              <p>The sightings could not be loaded: {queue.error.message}</p>
              <button type="button" className="btn-quiet mt-2" onClick={() => void queue.refetch()}>Try again</button>
            </div>
          )}
          {queue.isPending && <p role="status" className="card">Loading the sightings…</p>}
          {page && rows.length === 0 && <p className="card">{query.status === "waiting" && filterKey === "" ? "Nothing is waiting for review." : "No sighting matches this filter."}</p>}
          {page && rows.length > 0 && (
            <QueueTable
              rows={rows}
              total={total}
              query={query}
              onQuery={setQuery}
              currentId={currentId}
              onOpen={(id) => open(id)}
              register={register}
              selection={selection}
              onSelection={(next) => setPicked({ filterKey, selection: next, allMatching: false })}
              busy={queue.isFetching}
              caption={`Sightings, ${statusFilterLabel[query.status].toLowerCase()}, sorted by ${sortWords[query.sort]} (${query.dir === "desc" ? "newest or highest first" : "oldest or lowest first"}); page ${query.page} of ${pages}.`}
            />
          )}
        </section>
        <aside aria-label="The open sighting" className={`${currentId ? "" : "hidden lg:block"} lg:sticky lg:top-2 lg:max-h-[calc(100dvh-1rem)] lg:overflow-y-auto`}>
          {currentId ? (
            <div className="card">
              <SightingDetail
                key={currentId}
                id={currentId}
                row={rows.find((r) => r.id === currentId) ?? null}
                tileUrl={tileUrl}
                panel={panel}
                onPanel={setPanel}
                run={current ? runOn(current) : async () => {}}
                onConfirm={confirm}
                busy={act.isPending}
                confirmError={confirmError}
                changed={changed}
                onBack={() => {
                  const id = currentId;
                  open(null);
                  focusWanted.current = null;
                  requestAnimationFrame(() => rowButtons.current.get(id)?.focus());
                }}
                onPhoto={setPhoto}
                headingRef={heading}
              />
            </div>
          ) : (
            <p className="card text-shingle-700">Choose a sighting to see it here, or press <kbd className="rounded border border-shingle-400 px-1 font-mono">j</kbd> to open the first. Press <kbd className="rounded border border-shingle-400 px-1 font-mono">?</kbd> for every shortcut.</p>
          )}
        </aside>
      </div>
      {help && <HelpOverlay onClose={() => setHelp(false)} />}
      {detailForPhoto && photo !== null && detailForPhoto.photos.length > 0 && <PhotoViewer photos={detailForPhoto.photos} start={photo} speciesName={detailForPhoto.species.vernacularName} onClose={() => setPhoto(null)} />}
    </div>
  );
}
