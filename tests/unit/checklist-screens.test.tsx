import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ChecklistImport } from "@/components/network/checklist/checklist-import";
import { EntryEditor } from "@/components/network/checklist/entry-editor";

// The checklist screens against a fake of their route handlers (fetch), as the organiser uses them.
vi.mock("next/link", () => ({ default: ({ href, children, ...rest }: { href: string; children: React.ReactNode }) => <a href={href} {...rest}>{children}</a> }));
const router = vi.hoisted(() => ({ refresh: vi.fn() }));
vi.mock("next/navigation", () => ({ useRouter: () => router }));

const wrap = (ui: React.ReactElement) => render(<QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>{ui}</QueryClientProvider>);
type Call = { url: string; method: string; body: unknown };
function fakeRoutes(answer: (call: Call) => { status: number; json: unknown }) {
  const calls: Call[] = [];
  vi.spyOn(globalThis, "fetch").mockImplementation(async (input, init) => {
    const call = { url: String(input), method: init?.method ?? "GET", body: init?.body ? JSON.parse(String(init.body)) : undefined };
    calls.push(call);
    const { status, json } = answer(call);
    return new Response(JSON.stringify(json), { status, headers: { "content-type": "application/json" } });
  });
  return calls;
}
const csvFile = (text: string, name = "checklist.csv") => new File([text], name, { type: "text/csv" });

afterEach(() => vi.restoreAllMocks());

// A first render on a busy machine can take seconds (module loading), hence the timeouts.
describe("importing a checklist file", { timeout: 20_000 }, () => {
  const plan = {
    entries: [
      { line: 2, id: "s1", status: "changed", values: { scientificName: "Aglais io", vernacularName: "Peacock", taxonRank: "species", sensitive: false, activeMonths: [3, 4], tags: [], synonyms: ["Inachis io"], covers: [] }, changes: [{ field: "synonyms", before: [], after: ["Inachis io"] }] },
      { line: 3, id: null, status: "new", values: { scientificName: "Cacyreus marshalli", vernacularName: "Geranium Bronze", taxonRank: "species", sensitive: false, activeMonths: [6, 7, 8, 9, 10], tags: ["Non-native"], synonyms: [], covers: [] }, changes: [] },
      { line: 4, id: "s2", status: "unchanged", values: { scientificName: "Maniola jurtina", vernacularName: "Meadow Brown", taxonRank: "species", sensitive: false, activeMonths: [], tags: [], synonyms: [], covers: [] }, changes: [] },
    ],
    newTags: ["Non-native"],
    counts: { added: 1, changed: 1, unchanged: 1 },
  };

  it("previews the chosen file, then imports that same file with the preview's hash", async () => {
    const calls = fakeRoutes((c) =>
      c.url.endsWith("/import/preview") ? { status: 200, json: { plan, previewHash: "h1" } } : { status: 200, json: { imported: { added: 1, changed: 1, unchanged: 1, newTags: 1 } } },
    );
    wrap(<ChecklistImport />);
    fireEvent.change(screen.getByLabelText(/Checklist file/), { target: { files: [csvFile("scientific_name,vernacular_name\n")] } });
    expect(await screen.findByText(/Nothing is written until you import/)).toHaveTextContent("1 new, 1 changed, 1 unchanged; new tags: Non-native.");
    expect(screen.getByRole("row", { name: /Aglais io/ })).toHaveTextContent("Synonymsnone → Inachis io");
    expect(screen.queryByRole("row", { name: /Maniola jurtina/ })).toBeNull();
    fireEvent.click(screen.getByLabelText("Show unchanged entries too"));
    expect(screen.getByRole("row", { name: /Maniola jurtina/ })).toHaveTextContent("Unchanged");

    fireEvent.click(screen.getByRole("button", { name: "Import 1 new and 1 changed" }));
    expect(await screen.findByText(/^Imported: 1 new and 1 changed entries, 1 new tags\./)).toBeInTheDocument();
    expect(calls.map((c) => [c.method, c.url])).toEqual([
      ["POST", "/api/network/checklist/import/preview"],
      ["POST", "/api/network/checklist/import"],
    ]);
    expect(calls[1]!.body).toEqual({ fileName: "checklist.csv", text: "scientific_name,vernacular_name\n", previewHash: "h1" });
  });

  it("lists every problem of a refused file by line and column, and offers no import", async () => {
    fakeRoutes(() => ({
      status: 400,
      json: { error: { code: "invalid_file", message: "The file was not imported: 2 problems to put right. Nothing was written.", fields: {}, problems: [{ line: 4, column: "active_months", reason: "13 is not a month." }, { line: 9, column: null, reason: "This line has 3 values." }] } },
    }));
    wrap(<ChecklistImport />);
    fireEvent.change(screen.getByLabelText(/Checklist file/), { target: { files: [csvFile("x")] } });
    expect(await screen.findByRole("heading", { name: "The file was not imported: 2 problems to put right. Nothing was written." })).toBeInTheDocument();
    expect(screen.getAllByRole("listitem").map((li) => li.textContent)).toEqual(["Line 4, column active_months: 13 is not a month.", "Line 9: This line has 3 values."]);
    expect(screen.queryByRole("button", { name: /^Import/ })).toBeNull();
  });

  it("refuses a file over 10 MB before sending it", async () => {
    const calls = fakeRoutes(() => ({ status: 500, json: {} }));
    wrap(<ChecklistImport />);
    const big = csvFile("x");
    Object.defineProperty(big, "size", { value: 10 * 1024 * 1024 + 1 });
    fireEvent.change(screen.getByLabelText(/Checklist file/), { target: { files: [big] } });
    expect(await screen.findByRole("alert")).toHaveTextContent("The file is larger than 10 MB.");
    expect(calls).toEqual([]);
  });
});

describe("editing one entry", { timeout: 20_000 }, () => {
  const entry = { id: "11111111-1111-4111-8111-111111111111", scientificName: "Aglais io", vernacularName: "Peacock", taxonRank: "species", sensitive: false, activeMonths: [3, 4, 5], tags: [], synonyms: [], covers: [], coveredBy: [], sightings: 12 };
  const routes = (patch: (body: unknown) => { status: number; json: unknown }) =>
    fakeRoutes((c) => {
      if (c.method === "PATCH") return patch(c.body);
      if (c.url.endsWith("/tags")) return { status: 200, json: { tags: [{ id: "22222222-2222-4222-8222-222222222222", slug: "wider-countryside", label: "Wider countryside", description: null, species: 3 }] } };
      if (c.url.endsWith(entry.id)) return { status: 200, json: { entry } };
      return { status: 200, json: { entries: [entry] } };
    });

  it("checks the form with the server's schema before sending: an empty name is not sent", async () => {
    const calls = routes(() => ({ status: 200, json: { changed: true, entry } }));
    wrap(<EntryEditor id={entry.id} />);
    fireEvent.change(await screen.findByLabelText("Scientific name"), { target: { value: "" } });
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    expect(await screen.findByText("Enter the scientific name.")).toBeInTheDocument();
    expect(calls.filter((c) => c.method === "PATCH")).toEqual([]);
  });

  it("says the entry was saved, and still says so once the saved entry is read back", async () => {
    let stored = entry;
    routes((body) => {
      stored = { ...entry, vernacularName: (body as { vernacularName: string }).vernacularName };
      return { status: 200, json: { changed: true, entry: stored } };
    });
    // The entry route answers with what was stored last.
    const fetchMock = vi.mocked(globalThis.fetch);
    const answer = fetchMock.getMockImplementation()!;
    fetchMock.mockImplementation(async (input, init) => (String(input).endsWith(entry.id) && !init?.method ? new Response(JSON.stringify({ entry: stored }), { status: 200 }) : answer(input, init)));
    wrap(<EntryEditor id={entry.id} />);
    fireEvent.change(await screen.findByLabelText("Vernacular name"), { target: { value: "Peacock butterfly" } });
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    expect(await screen.findByText("Saved. The change is in the network's history.")).toBeInTheDocument();
    await waitFor(() => expect(screen.getByLabelText("Vernacular name")).toHaveValue("Peacock butterfly"));
    await waitFor(() => expect(router.refresh).toHaveBeenCalled());
    expect(screen.getByText("Saved. The change is in the network's history.")).toBeInTheDocument();
  });

  it("sends every field and shows the server's field messages beside the fields", async () => {
    const calls = routes(() => ({ status: 400, json: { error: { code: "invalid", message: "Some fields need attention.", fields: { synonyms: ['"Aglais urticae" is the scientific name of another entry.'] } } } }));
    wrap(<EntryEditor id={entry.id} />);
    fireEvent.change(await screen.findByLabelText("Synonyms (one per line)"), { target: { value: "Inachis io\n\nAglais urticae" } });
    fireEvent.click(screen.getByLabelText("Wider countryside"));
    fireEvent.click(screen.getByLabelText("Jun"));
    fireEvent.click(screen.getByRole("button", { name: "Save changes" }));
    expect(await screen.findByText('"Aglais urticae" is the scientific name of another entry.')).toBeInTheDocument();
    expect(calls.find((c) => c.method === "PATCH")!.body).toEqual({
      scientificName: "Aglais io",
      vernacularName: "Peacock",
      taxonRank: "species",
      sensitive: false,
      activeMonths: [3, 4, 5, 6],
      tagIds: ["22222222-2222-4222-8222-222222222222"],
      synonyms: ["Inachis io", "Aglais urticae"],
      covers: [],
    });
  });
});
