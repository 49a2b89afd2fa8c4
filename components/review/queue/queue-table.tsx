"use client";

import { createColumnHelper, rowPaginationFeature, rowSelectionFeature, rowSortingFeature, tableFeatures, useTable, type PaginationState, type RowSelectionState, type SortingState, type Updater } from "@tanstack/react-table";
import { createContext, useContext, useMemo, type ReactNode } from "react";
import type { QueueRow } from "@/lib/review/contract";
import { QUEUE_PAGE_SIZES, queueSorts, type QueueQuery, type QueueSort } from "@/lib/review/queue-filter";
import { walkSourceText } from "@/lib/import/walk-source";
import { walkDate } from "./format";
import { groupTallies, matchesStatus, sectionWords, statusWords, warningWords } from "./rows";

// The queue's table: react-table keeps the sorting, paging and row selection; the server sorts
// and pages (manual), so the rows arrive as they are shown.

const features = tableFeatures({ rowSortingFeature, rowSelectionFeature, rowPaginationFeature });
const helper = createColumnHelper<typeof features, QueueRow>();

type RowUi = { open: (id: string) => void; register: (id: string, el: HTMLButtonElement | null) => void; currentId: string | null };
const RowUiContext = createContext<RowUi>({ open: () => {}, register: () => {}, currentId: null });

function OpenButton({ row }: { row: QueueRow }) {
  const ui = useContext(RowUiContext);
  return (
    <button
      type="button"
      ref={(el) => ui.register(row.id, el)}
      className="text-left font-bold text-tideline-700 underline-offset-2 hover:underline"
      aria-current={ui.currentId === row.id ? "true" : undefined}
      onClick={(e) => {
        e.stopPropagation();
        ui.open(row.id);
      }}
    >
      {row.species.vernacularName}
      <span className="sr-only">, {walkDate(row.walk.date)}, {row.volunteer.name}</span>
    </button>
  );
}

const columns = helper.columns([
  helper.display({
    id: "select",
    header: ({ table }) => (
      <input
        type="checkbox"
        className="h-5 w-5"
        aria-label="Select every sighting on this page"
        checked={table.getIsAllPageRowsSelected()}
        ref={(el) => {
          if (el) el.indeterminate = !table.getIsAllPageRowsSelected() && table.getIsSomePageRowsSelected();
        }}
        onChange={table.getToggleAllPageRowsSelectedHandler()}
      />
    ),
    cell: ({ row }) => (
      <input
        type="checkbox"
        className="h-5 w-5"
        aria-label={`Select ${row.original.species.vernacularName}, ${walkDate(row.original.walk.date)}, ${row.original.volunteer.name}`}
        checked={row.getIsSelected()}
        onClick={(e) => e.stopPropagation()}
        onChange={row.getToggleSelectedHandler()}
      />
    ),
  }),
  helper.display({
    id: "photo",
    header: "Photo",
    cell: ({ row }) =>
      row.original.thumbnailUrl ? (
        <span className="relative inline-block">
          {/* eslint-disable-next-line @next/next/no-img-element -- a short-lived signed thumbnail from the object store */}
          <img src={row.original.thumbnailUrl} alt={`Photo of the ${row.original.species.vernacularName} sighting`} className="h-12 w-12 rounded border border-shingle-200 object-cover" loading="lazy" />
          {row.original.photoCount > 1 && <span className="absolute -right-1 -bottom-1 rounded bg-shingle-800 px-1 text-xs text-white">{row.original.photoCount}</span>}
        </span>
      ) : (
        <span className="text-sm text-shingle-600">None</span>
      ),
  }),
  helper.accessor((r) => r.species.vernacularName, {
    id: "species",
    header: "Species",
    cell: ({ row }) => (
      <span>
        <OpenButton row={row.original} />
        <i className="block text-sm text-shingle-600">{row.original.species.scientificName}</i>
        {row.original.species.aggregate && <span className="text-xs text-sand-800">aggregate</span>}
      </span>
    ),
  }),
  helper.accessor("count", {
    header: "Count",
    cell: ({ row }) => (
      <span>
        <span className="font-bold">{row.original.count}</span>
        {row.original.tally.entries > 1 && (
          <span className="block text-xs text-shingle-600">
            1 of {row.original.tally.entries} entries, {row.original.tally.sum} in all
          </span>
        )}
      </span>
    ),
  }),
  helper.accessor((r) => r.transect.code, {
    id: "transect",
    header: "Transect",
    cell: ({ row }) => (
      <span>
        <span className="font-mono">{row.original.transect.code}</span>
        <span className="block text-sm text-shingle-600">{sectionWords(row.original.section).replace(/^s/, "S")}</span>
      </span>
    ),
  }),
  helper.accessor((r) => r.walk.date, { id: "date", header: "Date", cell: ({ row }) => <span className="whitespace-nowrap">{walkDate(row.original.walk.date)}</span> }),
  helper.accessor((r) => r.volunteer.name, {
    id: "volunteer",
    header: "Volunteer",
    cell: ({ row }) => {
      const source = walkSourceText(row.original.walk);
      return (
        <span>
          {row.original.volunteer.name}
          {source && <span className="block text-xs text-shingle-600">{source}</span>}
        </span>
      );
    },
  }),
  helper.display({
    id: "warnings",
    header: "Warnings",
    cell: ({ row }) => {
      const words = warningWords(row.original);
      return words.length === 0 ? (
        <span className="text-sm text-shingle-600">None</span>
      ) : (
        <ul className="space-y-0.5 text-sm">
          {words.map((w) => (
            <li key={w} className="rounded bg-sand-100 px-1 text-sand-800">{w}</li>
          ))}
        </ul>
      );
    },
  }),
  helper.accessor("status", {
    header: "Status",
    cell: ({ row }) => {
      const { status, marks } = statusWords(row.original);
      return (
        <span className="text-sm">
          {status}
          {marks.map((m) => (
            <span key={m} className="ml-1 inline-block rounded bg-tideline-50 px-1 font-bold text-tideline-800">{m}</span>
          ))}
        </span>
      );
    },
  }),
]);

const sortable = new Set<string>(queueSorts);

export type Selection = Record<string, number>;

/** The sightings of one page, their tallies grouped, with sorting, paging and selection. */
export function QueueTable(props: {
  rows: QueueRow[];
  total: number;
  query: QueueQuery;
  onQuery: (next: Partial<QueueQuery>) => void;
  currentId: string | null;
  onOpen: (id: string) => void;
  register: (id: string, el: HTMLButtonElement | null) => void;
  selection: Selection;
  onSelection: (next: Selection) => void;
  busy: boolean;
  caption: ReactNode;
}) {
  const { rows, total, query, onQuery, selection, onSelection } = props;
  const sorting: SortingState = useMemo(() => [{ id: query.sort, desc: query.dir === "desc" }], [query.sort, query.dir]);
  const pagination: PaginationState = useMemo(() => ({ pageIndex: query.page - 1, pageSize: query.pageSize }), [query.page, query.pageSize]);
  const rowSelection: RowSelectionState = useMemo(() => Object.fromEntries(Object.keys(selection).map((id) => [id, true as const])), [selection]);
  const resolve = <T,>(u: Updater<T>, old: T): T => (typeof u === "function" ? (u as (o: T) => T)(old) : u);

  const table = useTable({
    features,
    columns,
    data: rows,
    getRowId: (r) => r.id,
    rowCount: total,
    manualSorting: true,
    manualPagination: true,
    enableSortingRemoval: false,
    enableMultiSort: false,
    state: { sorting, pagination, rowSelection },
    onSortingChange: (u) => {
      const next = resolve(u, sorting)[0];
      if (next && sortable.has(next.id)) onQuery({ sort: next.id as QueueSort, dir: next.desc ? "desc" : "asc", page: 1 });
    },
    onPaginationChange: (u) => {
      const next = resolve(u, pagination);
      onQuery({ page: next.pageIndex + 1, pageSize: next.pageSize as QueueQuery["pageSize"] });
    },
    onRowSelectionChange: (u) => {
      const next = resolve(u, rowSelection);
      const revisions = new Map(rows.map((r) => [r.id, r.revision]));
      onSelection(Object.fromEntries(Object.keys(next).map((id) => [id, selection[id] ?? revisions.get(id) ?? 0])));
    },
  });

  const byId = new Map(table.getRowModel().rows.map((r) => [r.id, r]));
  const groups = groupTallies(rows);
  const width = table.getAllLeafColumns().length;
  const ui = useMemo<RowUi>(() => ({ open: props.onOpen, register: props.register, currentId: props.currentId }), [props.onOpen, props.register, props.currentId]);
  const pages = Math.max(1, table.getPageCount());

  return (
    <RowUiContext.Provider value={ui}>
      <div className="overflow-x-auto rounded-xl border border-shingle-200 bg-white">
        <table className="w-full border-collapse text-left" aria-busy={props.busy || undefined} data-testid="review-queue">
          <caption className="sr-only">{props.caption}</caption>
          <thead className="bg-shingle-50">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} className="border-b border-shingle-200">
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = sortable.has(header.column.id);
                  return (
                    <th key={header.id} scope="col" className="p-2 text-sm font-bold text-shingle-800" aria-sort={canSort ? (sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none") : undefined}>
                      {canSort ? (
                        <button type="button" className="inline-flex min-h-tap items-center gap-1 font-bold" onClick={header.column.getToggleSortingHandler()}>
                          <table.FlexRender header={header} />
                          <span aria-hidden="true" className="text-shingle-600">{sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}</span>
                        </button>
                      ) : header.isPlaceholder ? null : (
                        <table.FlexRender header={header} />
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          {groups.map((g) => (
            <tbody key={g.key} className={g.tally ? "border-l-4 border-tideline-600" : undefined} data-tally={g.tally ? g.tally.entries : undefined}>
              {g.tally && (
                <tr className="bg-tideline-50">
                  <th scope="rowgroup" colSpan={width} className="px-2 py-1 text-left text-sm font-normal text-tideline-800">
                    <strong>The volunteer&apos;s tally:</strong> {g.rows.length} entries of {g.rows[0]!.species.vernacularName} in {sectionWords(g.rows[0]!.section)} of one walk, <strong>{g.tally.sum} in all</strong>. Counted as seen, one entry at a time; not an error.
                  </th>
                </tr>
              )}
              {g.rows.map((r) => {
                const row = byId.get(r.id);
                if (!row) return null;
                const current = props.currentId === r.id;
                const left = !matchesStatus(r, query.status);
                return (
                  <tr
                    key={r.id}
                    data-row-id={r.id}
                    data-current={current || undefined}
                    className={`border-b border-shingle-100 align-top ${current ? "bg-sand-100 outline-2 -outline-offset-2 outline-tideline-600" : "hover:bg-shingle-50"} ${left ? "text-shingle-600" : ""} cursor-pointer`}
                    onClick={() => props.onOpen(r.id)}
                  >
                    {row.getAllCells().map((cell) => (
                      <td key={cell.id} className="p-2">
                        <table.FlexRender cell={cell} />
                      </td>
                    ))}
                  </tr>
                );
              })}
            </tbody>
          ))}
        </table>
      </div>
      <nav aria-label="Pages of sightings" className="mt-3 flex flex-wrap items-center gap-2">
        <button type="button" className="btn-quiet" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>Previous page</button>
        <span className="text-sm">
          Page {query.page} of {pages} · {total.toLocaleString("en-GB")} {total === 1 ? "sighting" : "sightings"}
        </span>
        <button type="button" className="btn-quiet" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>Next page</button>
        <label className="ml-auto flex items-center gap-2 text-sm">
          Per page
          <select className="field-input mt-0 w-auto" value={query.pageSize} onChange={(e) => onQuery({ pageSize: Number(e.target.value) as QueueQuery["pageSize"], page: 1 })}>
            {QUEUE_PAGE_SIZES.map((n) => (
              <option key={n} value={n}>{n}</option>
            ))}
          </select>
        </label>
      </nav>
    </RowUiContext.Provider>
  );
}
