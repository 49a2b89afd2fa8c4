import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, waitFor, within } from "@testing-library/react";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { FieldHome } from "@/components/field/field-home";
import { addDays, localToday, mondayOf } from "@/lib/effort/weeks";
import { phoneStore, setFieldUser } from "@/lib/offline/phone-store";
import type { FieldReference } from "@/lib/offline/reference";
import { fieldReference, fieldVolunteer, freshFieldDb, otherVolunteer, transectA, transectB } from "./field-fixtures";

// "Not walked this week because of the weather": one tap per transect on the field home, stored
// on the phone with no signal and sent by the outbox later.
const syncNow = vi.hoisted(() => vi.fn());
vi.mock("@/lib/offline/sync-controller", () => ({ syncNow, onSyncState: () => () => undefined }));

const BUTTON = /^Not walked this week: bad weather/;
const today = localToday();

function referenceWith(seasons: FieldReference["seasons"]): FieldReference {
  return { ...fieldReference(), seasons };
}
const openNow = referenceWith([{ name: "Test season", startsOn: addDays(today, -30), endsOn: addDays(today, 30), phase: "open" }]);

function renderHome(reference: FieldReference) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false } } });
  return render(
    <QueryClientProvider client={client}>
      <FieldHome firstName="Ada" initial={reference} />
    </QueryClientProvider>,
  );
}

/** Both transects' buttons are there (each card's button appears once the phone's store has answered). */
const bothButtons = () => waitFor(() => expect(screen.getAllByRole("button", { name: BUTTON })).toHaveLength(2));

const card = (code: string) => screen.getAllByTestId("assigned-transect").find((c) => c.textContent?.includes(code))!;

describe("the field home's weather report", () => {
  let fetched: number;
  beforeEach(() => {
    freshFieldDb();
    syncNow.mockClear();
    fetched = 0;
    // No signal: every request fails.
    vi.stubGlobal("fetch", vi.fn(async () => {
      fetched++;
      throw new TypeError("Failed to fetch");
    }));
  });

  it("is one tap per transect that works with no signal: stored on the phone for this week and shown as reported", async () => {
    renderHome(openNow);
    await bothButtons();
    const buttons = screen.getAllByRole("button", { name: BUTTON });
    // Field controls are at least 44 px (min-h-tap in tailwind.config.ts).
    for (const b of buttons) expect(b.className).toMatch(/\bmin-h-tap\b/);
    const fetchesBefore = fetched;

    fireEvent.click(within(card("DUN-01")).getByRole("button", { name: BUTTON }));
    const shown = await within(card("DUN-01")).findByTestId("weather-report");
    expect(shown).toHaveTextContent("Reported: not walked this week because of the weather");
    expect(shown).toHaveTextContent(`week of ${mondayOf(today)}`);
    expect(shown).toHaveTextContent("On this phone, sent when there is signal.");
    // The other transect still offers its own button.
    expect(within(card("DUN-02")).getByRole("button", { name: BUTTON })).toBeInTheDocument();

    const stored = await phoneStore().weatherMisses.toArray();
    expect(stored).toEqual([expect.objectContaining({ ownerId: fieldVolunteer, transectId: transectA, reportedOn: today, weekStart: mondayOf(today), outbox: "on-phone" })]);
    // Queued, not sent: the outbox is asked to try, and nothing went over the network for it.
    expect(syncNow).toHaveBeenCalled();
    expect(fetched).toBe(fetchesBefore);
    // The outbox counts it as waiting.
    expect(screen.getByTestId("outbox-on-phone")).toHaveTextContent("1");
  });

  it("can be taken back while it is still on the phone, and not once sent", async () => {
    renderHome(openNow);
    await bothButtons();
    fireEvent.click(within(card("DUN-02")).getByRole("button", { name: BUTTON }));
    fireEvent.click(await within(card("DUN-02")).findByRole("button", { name: /^Take back the weather report/ }));
    expect(await within(card("DUN-02")).findByRole("button", { name: BUTTON })).toBeInTheDocument();
    expect(await phoneStore().weatherMisses.count()).toBe(0);

    fireEvent.click(within(card("DUN-02")).getByRole("button", { name: BUTTON }));
    await within(card("DUN-02")).findByTestId("weather-report");
    await phoneStore().weatherMisses.where("transectId").equals(transectB).modify({ outbox: "sent" });
    await waitFor(() => expect(within(card("DUN-02")).getByTestId("weather-report")).toHaveTextContent("Sent."));
    expect(within(card("DUN-02")).queryByRole("button", { name: /^Take back/ })).toBeNull();
  });

  it("shows a refusal with the server's reason, in the outbox too", async () => {
    renderHome(openNow);
    await bothButtons();
    fireEvent.click(within(card("DUN-01")).getByRole("button", { name: BUTTON }));
    await within(card("DUN-01")).findByTestId("weather-report");
    await phoneStore().weatherMisses.toCollection().modify({ outbox: "needs-attention", attention: "You are not assigned to that transect." });
    await waitFor(() => expect(within(card("DUN-01")).getByTestId("weather-report")).toHaveTextContent("Sent back: You are not assigned to that transect."));
    expect(screen.getByTestId("refused-weather")).toHaveTextContent("You are not assigned to that transect.");
  });

  it("is not offered outside an open season, nor another volunteer's report shown", async () => {
    await phoneStore().weatherMisses.add({ id: crypto.randomUUID(), ownerId: otherVolunteer, transectId: transectA, reportedOn: today, weekStart: mondayOf(today), clientUpdatedAt: new Date().toISOString(), outbox: "on-phone", attention: null, attempts: 0 });
    const view = renderHome(openNow);
    await bothButtons();
    view.unmount();

    setFieldUser(fieldVolunteer);
    renderHome(referenceWith([{ name: "Last season", startsOn: addDays(today, -200), endsOn: addDays(today, -20), phase: "grace" }]));
    await screen.findByTestId("outbox");
    await waitFor(() => expect(screen.getAllByTestId("assigned-transect")).toHaveLength(2));
    // Give the phone's store time to answer (the buttons above appeared well within this).
    await new Promise((resolve) => setTimeout(resolve, 300));
    expect(screen.queryByRole("button", { name: BUTTON })).toBeNull();
  });
});
