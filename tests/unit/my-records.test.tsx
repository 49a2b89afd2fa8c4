import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";
import { MyRecords } from "@/components/field/my-records";
import { phoneStore } from "@/lib/offline/phone-store";
import { createVisit, submitVisit } from "@/lib/offline/records";
import { keepReference } from "@/lib/offline/reference";
import { keepRecordsCopy, RECORDS_COPY_VERSION, savedRecordsCopy, type RecordsCopy, type RecordSighting } from "@/lib/offline/records-copy";
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
  decision: null,
  corrections: [],
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
            conversation: [{ from: "reviewer", message: "Was the underside spotted?", at: "2026-07-03T18:00:00.000Z" }],
          }),
          sighting({
            id: answeredId,
            vernacularName: "Grayling",
            status: "queried",
            question: "Which section exactly?",
            awaitingReply: false,
            conversation: [
              { from: "reviewer", message: "Which section exactly?", at: "2026-07-03T18:05:00.000Z" },
              { from: "volunteer", message: "Section 3, by the boardwalk.", at: "2026-07-03T19:00:00.000Z" },
            ],
          }),
          sighting({ vernacularName: "Meadow Brown", status: "accepted", decision: { action: "accept", reason: null, reasonText: null, note: null, at: "2026-07-03T18:10:00.000Z" } }),
          sighting({
            vernacularName: "Dark Green Fritillary",
            status: "rejected",
            decision: { action: "reject", reason: "photo_not_conclusive", reasonText: "The photo does not show what is needed to name it", note: "The underwing is out of focus.", at: "2026-07-03T18:20:00.000Z" },
          }),
          sighting({
            vernacularName: "Common Blue",
            count: 3,
            status: "accepted",
            decision: { action: "accept", reason: null, reasonText: null, note: null, at: "2026-07-03T18:40:00.000Z" },
            corrections: [
              { fromName: "Silver-studded Blue", toName: "Common Blue", fromCount: null, toCount: null, note: "Orange spots reach the forewing.", at: "2026-07-03T18:30:00.000Z" },
              { fromName: null, toName: null, fromCount: 30, toCount: 3, note: null, at: "2026-07-03T18:35:00.000Z" },
            ],
          }),
          sighting({ vernacularName: "Ringlet", status: "pending" }),
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

describe("my walks", () => {
  beforeEach(() => {
    freshFieldDb();
  });
  afterEach(() => {
    vi.unstubAllGlobals();
  });

  it("shows each sighting's outcome in the settled words: confirmed, a question, not used in counts with the reason and note, corrected with old and new names", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(records())));
    renderRecords();
    expect(await screen.findByRole("heading", { level: 1 })).toHaveTextContent("My walks");
    await screen.findByText(/Small Blue/);
    const status = (name: string) => within(rowOf(name)).getByTestId("sighting-status").textContent;
    expect(status("Small Blue")).toBe("A question for you");
    expect(status("Meadow Brown")).toBe("Confirmed");
    expect(status("Ringlet")).toBe("Waiting for review");
    expect(within(rowOf("Small Blue")).getByText(/Reviewer asked/)).toBeInTheDocument();

    const setAside = rowOf("Dark Green Fritillary");
    expect(within(setAside).getByTestId("sighting-status")).toHaveTextContent("Not used in counts");
    expect(setAside).toHaveTextContent("Why: The photo does not show what is needed to name it");
    expect(setAside).toHaveTextContent("Reviewer's note: The underwing is out of focus.");

    const corrected = rowOf("Common Blue");
    expect(corrected).toHaveTextContent("Corrected");
    expect(within(corrected).getByText(/Corrected from Silver-studded Blue to Common Blue/)).toHaveTextContent("Orange spots reach the forewing.");
    expect(within(corrected).getByText(/Count corrected from 30 to 3/)).toBeInTheDocument();
    // Nothing else was corrected, set aside or given a note.
    expect(within(rowOf("Meadow Brown")).queryByTestId("sighting-outcome")).toBeNull();
    expect(within(rowOf("Small Blue")).queryByText("Corrected")).toBeNull();
    // None of the old words.
    expect(document.body.textContent).not.toMatch(/checker|Accepted|Not accepted|My records/i);
  });

  it("shows the answer box only while the reviewer waits, and the earlier answer with the question", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => json(records())));
    renderRecords();
    await screen.findByText(/Small Blue/);
    expect(within(rowOf("Small Blue")).getByLabelText("Your answer")).toBeInTheDocument();
    expect(within(rowOf("Small Blue")).getByText(/Was the underside spotted\?/)).toBeInTheDocument();

    const answered = rowOf("Grayling");
    expect(within(answered).queryByLabelText("Your answer")).toBeNull();
    expect(within(answered).getByText(/Which section exactly\?/)).toBeInTheDocument();
    expect(within(answered).getByText(/Section 3, by the boardwalk\./)).toBeInTheDocument();
    expect(answered).toHaveTextContent("Your answer is with the reviewer.");
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

  it("reads a copy saved by the previous version (no outcomes, questions from \"checker\") and stores the current version", async () => {
    const older = {
      asOf: "2026-07-04T09:30:00.000Z",
      visits: [{ id: "c3d4e5f6-a7b8-4c9d-8e1f-2a3b4c5d6e7f", visitDate: "2026-07-03", transectCode: "DUN-01", transectName: "North dunes", sightings: [
        { id: queriedId, vernacularName: "Small Blue", scientificName: "Cupido minimus", count: 1, section: 2, status: "queried", question: "Was the underside spotted?", awaitingReply: true,
          conversation: [{ from: "checker", message: "Was the underside spotted?", at: "2026-07-03T18:00:00.000Z" }] },
        { id: answeredId, vernacularName: "Grayling", scientificName: "Hipparchia semele", count: 1, section: 3, status: "rejected", question: null, awaitingReply: false, conversation: [] },
      ] }],
    };
    await phoneStore().reference.put({ key: `my-records:${volunteerId}`, value: older, savedAt: older.asOf });
    const saved = await savedRecordsCopy(volunteerId);
    expect(saved!.visits[0]!.sightings.map((s) => [s.conversation.map((m) => m.from), s.decision, s.corrections])).toEqual([[["reviewer"], null, []], [[], null, []]]);

    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
    renderRecords();
    await screen.findByText(/Small Blue/);
    expect(within(rowOf("Small Blue")).getByText(/Reviewer asked/)).toBeInTheDocument();
    expect(within(rowOf("Grayling")).getByTestId("sighting-status")).toHaveTextContent("Not used in counts");

    await keepRecordsCopy(volunteerId, records());
    expect(((await phoneStore().reference.get(`my-records:${volunteerId}`))!.value as { version: number }).version).toBe(RECORDS_COPY_VERSION);
    // A copy from a newer version is not guessed at.
    await phoneStore().reference.put({ key: `my-records:${volunteerId}`, value: { ...records(), version: RECORDS_COPY_VERSION + 1 }, savedAt: older.asOf });
    expect(await savedRecordsCopy(volunteerId)).toBeNull();
  });

  it("never shows another volunteer's saved copy", async () => {
    await phoneStore().reference.put({ key: "my-records:someone-else", value: records(), savedAt: "2026-07-04T09:30:00.000Z" });
    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
    renderRecords();
    expect(await screen.findByText(/Your sent walks show here once they have loaded/)).toBeInTheDocument();
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
    expect(within(rows[0]!).getByRole("link", { name: "Open this walk" })).toHaveAttribute("href", `/field/visit?id=${draft}&transect=${transectA}`);
    // It comes before the records from the server.
    await screen.findByText(/Small Blue/);
    expect(section.compareDocumentPosition(rowOf("Small Blue")) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });
});
