import { screen, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { groupTallies } from "@/components/review/queue/rows";
import { byId, page, renderQueue, row, rows, serveApi } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => vi.unstubAllGlobals());

const rowOf = (id: string) => document.querySelector<HTMLTableRowElement>(`[data-row-id="${byId(id).id}"]`)!;

describe("the queue's rows", () => {
  it("is a table with a header for every column", async () => {
    serveApi();
    await renderQueue();
    const table = screen.getByRole("table");
    expect(within(table).getAllByRole("columnheader").map((h) => h.textContent?.replace(/[▲▼↕]/g, "").trim())).toEqual(["", "Photo", "Species", "Count", "Transect", "Date", "Volunteer", "Warnings", "Status"]);
    expect(within(table).getByRole("checkbox", { name: "Select every sighting on this page" })).toBeInTheDocument();
  });

  it("shows species in both names, count, transect and section, date, volunteer, photo and warnings", async () => {
    serveApi();
    await renderQueue();
    const copper = rowOf("d");
    expect(within(copper).getByRole("button", { name: /^Small Copper/ })).toBeInTheDocument();
    expect(copper.textContent).toContain("Lycaena phlaeas");
    expect(copper.textContent).toContain("30");
    expect(copper.textContent).toContain("MSH-01");
    expect(copper.textContent).toContain("Section 1");
    expect(copper.textContent).toContain("13 Jun 2026");
    expect(copper.textContent).toContain("Ben Carrow");
    expect(copper.textContent).toContain("entered by Priya Coldharbour");
    // The sighting's warnings in words, then the walk's breach as one warning of its own.
    expect(within(copper).getAllByRole("listitem").map((li) => li.textContent)).toEqual(["Outside its usual months", "Far above earlier counts", "Walk outside the walk rules"]);
    expect(within(copper).queryByRole("img")).toBeNull();

    const white = rowOf("e");
    expect(within(white).getByRole("img", { name: "Photo of the Marbled White sighting" })).toHaveAttribute("src", "https://photos.example.invalid/thumbnails/e.jpg");
    expect(white.textContent).toContain("Waiting for review");
    expect(within(white).getAllByRole("cell")[7]!.textContent).toBe("None");
  });

  it("uses the reviewers' words for statuses, with the Answered and Corrected marks", async () => {
    serveApi();
    await renderQueue();
    const skipper = rowOf("f");
    const status = within(skipper).getAllByRole("cell").at(-1)!;
    expect(status.textContent).toBe("Question askedAnsweredCorrected");
    expect(rowOf("a").textContent).toContain("Waiting for review");
    expect(document.body.textContent).not.toMatch(/pending|queried/);
  });

  it("shows a tally's entries together with their sum, as the volunteer's tally and not an error", async () => {
    serveApi();
    await renderQueue();
    const tallies = document.querySelectorAll("tbody[data-tally]");
    expect(tallies).toHaveLength(1);
    const group = tallies[0] as HTMLElement;
    expect(group.dataset.tally).toBe("3");
    const header = within(group).getByRole("rowheader");
    expect(header.textContent).toMatch(/The volunteer's tally: 3 entries of Chalkhill Blue in section 4 of one walk, 12 in all/);
    expect(header.textContent).toMatch(/not an error/);
    expect(group.querySelectorAll("[data-row-id]")).toHaveLength(3);
    // Each entry still stands on its own, to be decided on its own.
    expect(within(group).getAllByRole("button", { name: /^Chalkhill Blue/ })).toHaveLength(3);
    // No warning is made of it.
    for (const tr of group.querySelectorAll("[data-row-id]")) expect(tr.textContent).toContain("None");
  });

  it("shows a tally's sum beside each entry when another sort separates them", async () => {
    const [a, b, c, d, e, f] = rows;
    serveApi({ queue: () => page([a!, d!, b!, e!, c!, f!]) });
    await renderQueue("/review?sort=species&dir=asc");
    expect(document.querySelectorAll("tbody[data-tally]")).toHaveLength(0);
    expect(rowOf("a").textContent).toContain("1 of 3 entries, 12 in all");
    expect(rowOf("c").textContent).toContain("1 of 3 entries, 12 in all");
    expect(rowOf("e").textContent).not.toContain("entries");
  });
});

describe("grouping tallies", () => {
  it("groups only adjacent entries of the same walk, species and section", () => {
    const walk = { id: "w", date: "2026-06-01", breaches: [], enteredBy: null, importedFrom: null };
    const t = { entries: 2, sum: 5 };
    const list = [row({ id: "1", walk, section: 3, tally: t }), row({ id: "2", walk, section: 3, tally: t }), row({ id: "3", walk, section: 4, tally: t }), row({ id: "4", walk, section: 3 }), row({ id: "5", walk, section: 4, tally: t })];
    const groups = groupTallies(list);
    expect(groups.map((g) => g.rows.map((r) => r.id))).toEqual([["1", "2"], ["3"], ["4"], ["5"]]);
    expect(groups.map((g) => g.tally?.sum ?? null)).toEqual([5, null, null, null]);
  });
});
