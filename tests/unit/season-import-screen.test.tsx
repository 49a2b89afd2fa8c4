import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { SeasonImport } from "@/components/network/earlier-seasons/season-import";

const seasons = [{ id: "11111111-1111-4111-8111-111111111111", name: "2024 season", startsOn: "2024-04-01", endsOn: "2024-09-30", status: "closed" }];
const counts = { walks: 3, emptyWalks: 1, sightings: 3, species: 3, transects: 2, newRecorders: 1 };

function renderScreen() {
  render(<QueryClientProvider client={new QueryClient()}><SeasonImport seasons={seasons} /></QueryClientProvider>);
  fireEvent.change(screen.getByLabelText("Walks file (CSV)"), { target: { files: [new File(["walk_ref"], "walks.csv", { type: "text/csv" })] } });
  fireEvent.change(screen.getByLabelText("Sightings file (CSV)"), { target: { files: [new File(["walk_ref"], "sightings.csv", { type: "text/csv" })] } });
  fireEvent.click(screen.getByRole("button", { name: "Preview" }));
}

afterEach(() => vi.unstubAllGlobals());

describe("the earlier seasons import screen", () => {
  it("shows the counts and the new recorders, then imports with the preview's hash", async () => {
    const hash = "a".repeat(64);
    const fetchMock = vi.fn(async (url: string) =>
      url.endsWith("/preview")
        ? Response.json({ counts, newRecorders: ["Agnes Threlkeld"], problems: [], moreProblems: 0, previewHash: hash, season: { name: "2024 season" } })
        : Response.json({ imported: { importId: "x", counts } }),
    );
    vi.stubGlobal("fetch", fetchMock);
    renderScreen();
    expect((await screen.findByRole("status")).textContent).toContain("3 walks (1 with no sightings)");
    expect(screen.getByText("Agnes Threlkeld")).toBeTruthy();
    fireEvent.click(screen.getByRole("button", { name: "Import 3 walks and 3 sightings" }));
    await waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(2));
    const sent = (fetchMock.mock.calls[1] as unknown as [string, RequestInit])[1].body as FormData;
    expect(sent.get("previewHash")).toBe(hash);
    expect(sent.get("recordStatus")).toBe("accepted");
    expect(sent.get("walks")).toBeTruthy();
    expect(sent.get("sightings")).toBeTruthy();
    expect(await screen.findByText(/Imported 3 walks and 3 sightings/)).toBeTruthy();
  });

  it("lists every problem by file and line, says how many more, and offers no import", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Response.json({
      counts, newRecorders: [], moreProblems: 12, previewHash: null, season: { name: "2024 season" },
      problems: [{ file: "sightings", line: 5, column: "species", reason: '"Papilio imaginarius" is not on the checklist, as a scientific name or a synonym.' }],
    })));
    renderScreen();
    expect(await screen.findByText('Sightings file, line 5, column species: "Papilio imaginarius" is not on the checklist, as a scientific name or a synonym.')).toBeTruthy();
    expect(screen.getByText(/and 12 more problems not listed/)).toBeTruthy();
    expect(screen.queryByRole("button", { name: /^Import/ })).toBeNull();
  });

  it("shows a refusal such as a file over 10 MB", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Response.json({ error: { code: "too_large", message: "The sightings file is larger than 10 MB (12.0 MB)." } }, { status: 413 })));
    renderScreen();
    expect((await screen.findByRole("alert")).textContent).toContain("larger than 10 MB");
  });
});
