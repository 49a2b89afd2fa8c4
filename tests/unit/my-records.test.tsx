import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { MyRecords } from "@/components/field/my-records";
import { phoneStore } from "@/lib/offline/phone-store";
import { createVisit, submitVisit } from "@/lib/offline/records";
import { keepReference } from "@/lib/offline/reference";
import type { RecordsCopy, RecordSighting } from "@/lib/offline/records-copy";
import { fieldReference, freshFieldDb, transectA, transectB } from "./field-fixtures";

const volunteerId = "3d9e0f1a-2b3c-4d5e-8f70-8192a3b4c5d6";
const queriedId = "a1b2c3d4-e5f6-4a7b-8c9d-0e1f2a3b4c5d";
const answeredId = "b2c3d4e5-f6a7-4b8c-9d0e-1f2a3b4c5d6e";

const sighting = (over: Partial<RecordSighting>): RecordSighting => ({
  id: crypto.randomUUID(),
  vernacularName: "Meadow Brown",
  scientificName: "Maniola jurtina",
  count: 2,
  section: 1,
  status: "pending",
  question: null,
  awaitingReply: false,
  conversation: [],
  ...over,
});

function records(): RecordsCopy {
  return {
    asOf: "2026-07-04T09:30:00.000Z",
    visits: [
      {
        id: "c3d4e5f6-a7b8-4c9d-8e1f-2a3b4c5d6e7f",
        visitDate: "2026-07-03",
        transectCode: "DUN-01",
        transectName: "North dunes",
        sightings: [
          sighting({
            id: queriedId,
            vernacularName: "Small Blue",
            status: "queried",
            question: "Was the underside spotted?",
            awaitingReply: true,
            conversation: [{ from: "checker", message: "Was the underside spotted?", at: "2026-07-03T18:00:00.000Z" }],
          }),
          sighting({
            id: answeredId,
            vernacularName: "Grayling",
            status: "queried",
            question: "Which section exactly?",
            awaitingReply: false,
            conversation: [
              { from: "checker", message: "Which section exactly?", at: "2026-07-03T18:05:00.000Z" },
              { from: "volunteer", message: "Section 3, by the boardwalk.", at: "2026-07-03T19:00:00.000Z" },
            ],
          }),
          sighting({ vernacularName: "Meadow Brown", status: "accepted" }),
        ],
      },
    ],
  };
}

function renderRecords() {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false, networkMode: "always" }, mutations: { networkMode: "always" } } });
  return render(
    <QueryClientProvider client={client}>
      <MyRecords volunteerId={volunteerId} />
    </QueryClientProvider>,
  );
}

const json = (body: unknown, status = 200) => new Response(JSON.stringify(body), { status, headers: { "Content-Type": "application/json" } });
const rowOf = (name: string) => screen.getAllByTestId("record-sighting").find((li) => li.textContent?.includes(name))!;

describe("my records", () => {
  beforeEach(() => {
    freshFieldDb();
  });
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it("shows the answer box only while the checker waits, and the earlier answer with the question", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(records())));
    renderRecords();
    await screen.findByText(/Small Blue/);
    expect(within(rowOf("Small Blue")).getByLabelText("Your answer")).toBeInTheDocument();
    expect(within(rowOf("Small Blue")).getByText(/Was the underside spotted\?/)).toBeInTheDocument();

    const answered = rowOf("Grayling");
    expect(within(answered).queryByLabelText("Your answer")).toBeNull();
    expect(within(answered).getByText(/Which section exactly\?/)).toBeInTheDocument();
    expect(within(answered).getByText(/Section 3, by the boardwalk\./)).toBeInTheDocument();
    expect(answered).toHaveTextContent("Your answer is with the checker.");
    expect(within(rowOf("Meadow Brown")).queryByLabelText("Your answer")).toBeNull();
  });

  it("hides the answer box once the answer is sent and shows the answer under the question", async () => {
    const fetcher = vi.fn(async (url: string, init?: RequestInit) => {
      if (url === "/api/field/records/reply") {
        const body = JSON.parse(String(init?.body)) as { sightingId: string; message: string };
        expect(body).toEqual({ sightingId: queriedId, message: "Yes, clearly." });
        return json({ id: crypto.randomUUID(), sightingId: queriedId, message: body.message, createdAt: "2026-07-04T10:00:00.000Z" }, 201);
      }
      return json(records());
    });
    vi.stubGlobal("fetch", fetcher);
    renderRecords();
    const box = await screen.findByLabelText("Your answer");
    fireEvent.change(box, { target: { value: "  Yes, clearly.  " } });
    fireEvent.click(screen.getByRole("button", { name: "Send answer" }));
    await waitFor(() => expect(within(rowOf("Small Blue")).queryByLabelText("Your answer")).toBeNull());
    expect(within(rowOf("Small Blue")).getByText(/Yes, clearly\./)).toBeInTheDocument();
    expect(fetcher.mock.calls.filter(([url]) => url === "/api/field/records/reply")).toHaveLength(1);
  });

  it("keeps an answer that could not be sent and says why", async () => {
    vi.stubGlobal("fetch", vi.fn(async (url: string) => {
      if (url === "/api/field/records/reply") throw new TypeError("Failed to fetch");
      return json(records());
    }));
    renderRecords();
    const box = await screen.findByLabelText("Your answer");
    fireEvent.change(box, { target: { value: "Yes." } });
    fireEvent.click(screen.getByRole("button", { name: "Send answer" }));
    expect(await screen.findByRole("alert")).toHaveTextContent("No signal: your answer was not sent");
    expect(screen.getByLabelText("Your answer")).toHaveValue("Yes.");
  });

  it("shows the last copy with its time when there is no signal", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(records())));
    const online = renderRecords();
    await screen.findByText(/Small Blue/);
    await waitFor(async () => expect(await phoneStore().reference.get(`my-records:${volunteerId}`)).toBeDefined());
    online.unmount();

    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
    renderRecords();
    await screen.findByText(/Small Blue/);
    const asOf = await screen.findByTestId("records-as-of");
    await waitFor(() => expect(asOf).toHaveTextContent("No signal."));
    const shownTime = new Date("2026-07-04T09:30:00.000Z").toLocaleString(undefined, { dateStyle: "medium", timeStyle: "short" });
    expect(asOf).toHaveTextContent(`as of ${shownTime}`);
    // An answer needs the network: the box is not offered offline.
    expect(screen.queryByLabelText("Your answer")).toBeNull();
  });

  it("never shows another volunteer's saved copy", async () => {
    await phoneStore().reference.put({ key: "my-records:someone-else", value: records(), savedAt: "2026-07-04T09:30:00.000Z" });
    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
    renderRecords();
    expect(await screen.findByText(/Your sent records show here once they have loaded/)).toBeInTheDocument();
    expect(screen.queryByText(/Small Blue/)).toBeNull();
  });

  it("lists the visits still on this phone first, with where each stands", async () => {
    await keepReference(fieldReference());
    const draft = await createVisit({ transectId: transectA, visitDate: "2026-07-05", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    const waiting = await createVisit({ transectId: transectB, visitDate: "2026-07-04", startTime: "09:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    await submitVisit(waiting, { endTime: "10:00", completeList: true, notes: null });
    const refused = await createVisit({ transectId: transectA, visitDate: "2026-07-01", startTime: "09:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    await submitVisit(refused, { endTime: "10:00", completeList: true, notes: null });
    await phoneStore().visits.update(refused, { outbox: "needs-attention", attention: "Not your transect." });
    const sent = await createVisit({ transectId: transectA, visitDate: "2026-06-30", startTime: "09:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    await submitVisit(sent, { endTime: "10:00", completeList: true, notes: null });
    await phoneStore().visits.update(sent, { outbox: "sent" });

    vi.stubGlobal("fetch", vi.fn(async () => json(records())));
    renderRecords();
    const section = await screen.findByTestId("visits-on-phone");
    const rows = within(section).getAllByTestId("visit-on-phone");
    expect(rows.map((r) => r.textContent)).toEqual([
      expect.stringMatching(/2026-07-05 · DUN-01 North dunes.*Walk in progress/),
      expect.stringMatching(/2026-07-04 · DUN-02 South slack.*Waiting to send/),
      expect.stringMatching(/2026-07-01 · DUN-01 North dunes.*Needs attention.*Not your transect\./),
    ]);
    expect(within(rows[0]!).getByRole("link", { name: "Open this visit" })).toHaveAttribute("href", `/field/visit?id=${draft}&transect=${transectA}`);
    // It comes before the records from the server.
    await screen.findByText(/Small Blue/);
    expect(section.compareDocumentPosition(rowOf("Small Blue")) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });
});
