import "fake-indexeddb/auto"; // before dexie loads, so it finds an IndexedDB
import { QueryClient, QueryClientProvider } from "@tanstack/react-query";
import { fireEvent, render, screen, within } from "@testing-library/react";
import { readFileSync } from "node:fs";
import { resolve } from "node:path";
import { beforeEach, describe, expect, it, vi } from "vitest";
import { FieldHome } from "@/components/field/field-home";
import { MyRecords } from "@/components/field/my-records";
import { SafetyGate } from "@/components/field/safety-gate";
import { RecordingScreen } from "@/components/field/visit/recording-screen";
import { SightingForm } from "@/components/field/visit/sighting-form";
import { StartVisitForm } from "@/components/field/visit/start-visit-form";
import { phoneStore } from "@/lib/offline/phone-store";
import { addPhoto, addSighting, createVisit, submitVisit } from "@/lib/offline/records";
import { keepReference } from "@/lib/offline/reference";
import tailwindConfig from "@/tailwind.config";
import { fieldReference, freshFieldDb, jpeg, meadowBrown, stubObjectUrls, transectA } from "./field-fixtures";

vi.mock("@/lib/offline/sync-controller", () => ({ syncNow: vi.fn(), onSyncState: () => () => undefined }));

/*
 * Every control on the field screens must be at least 44 x 44 CSS px: WCAG 2.5.5 Target Size
 * (https://www.w3.org/WAI/WCAG22/Understanding/target-size-enhanced), common practice for
 * one-thumb use outdoors. jsdom does no layout, so this checks the classes that set the size,
 * not measured boxes: a minimum height and a minimum width from the tap utilities (or a fixed
 * 44 px or larger size, or the full width of a phone column). The btn-* and field-input classes
 * are expanded from app/globals.css so a change there is caught too.
 */
const css = readFileSync(resolve(process.cwd(), "app/globals.css"), "utf8");
function expand(classes: string[], seen = new Set<string>()): string[] {
  return classes.flatMap((c) => {
    const rule = css.match(new RegExp(`@utility ${c} \\{ @apply ([^;]+);`));
    if (!rule || seen.has(c)) return [c];
    seen.add(c);
    return [c, ...expand(rule[1]!.split(/\s+/), seen)];
  });
}
// 2.75rem is 44 px at the browsers' default 16 px root size.
const tall = ["min-h-tap", "min-h-11", "min-h-12", "h-11", "h-12", "h-14", "h-16", "h-20"];
const wide = ["min-w-tap", "min-w-11", "min-w-12", "w-11", "w-12", "w-14", "w-16", "w-20", "w-full"];


function undersized(container: HTMLElement): string[] {
  const controls = container.querySelectorAll<HTMLElement>("button, a[href], input:not([type=hidden]), select, textarea, [role=button]");
  const problems: string[] = [];
  controls.forEach((el) => {
    // A small checkbox is fine inside a full-width label that is itself a tall target.
    const target = el.matches("input[type=checkbox], input[type=radio]") ? el.closest("label") : el;
    const classes = expand(Array.from(target?.classList ?? []));
    const widthOk = classes.some((c) => wide.includes(c)) || (target !== el && classes.includes("flex"));
    if (!classes.some((c) => tall.includes(c)) || !widthOk) problems.push(`${el.tagName.toLowerCase()} "${el.textContent?.trim() || el.getAttribute("aria-label") || el.id}" [${target?.className}]`);
  });
  return problems;
}

const reference = fieldReference();
const withQueries = (ui: React.ReactNode) => (
  <QueryClientProvider client={new QueryClient({ defaultOptions: { queries: { retry: false } } })}>{ui}</QueryClientProvider>
);

describe("tap targets on the field screens (at least 44 x 44 px)", () => {
  beforeEach(() => {
    freshFieldDb();
    stubObjectUrls();
    vi.stubGlobal("fetch", vi.fn(async () => {
      throw new TypeError("Failed to fetch");
    }));
  });

  it("the tap size is 2.75rem (44 px) in the Tailwind theme", () => {
    expect(tailwindConfig.theme?.extend?.minHeight).toMatchObject({ tap: "2.75rem" });
    expect(tailwindConfig.theme?.extend?.minWidth).toMatchObject({ tap: "2.75rem" });
  });

  it("a control without the classes is reported (the check can fail)", () => {
    const { container } = render(<div><button type="button" className="underline">remove</button><a href="/x" className="btn-quiet">ok height only</a></div>);
    expect(undersized(container)).toHaveLength(2);
  });

  it("field home", async () => {
    const draft = await createVisit({ transectId: transectA, visitDate: "2026-07-05", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    const refused = await createVisit({ transectId: transectA, visitDate: "2026-07-04", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    await submitVisit(refused, { endTime: "11:00", completeList: true, notes: null });
    await phoneStore().visits.update(refused, { outbox: "needs-attention", attention: "Not your transect." });
    const { container } = render(withQueries(<FieldHome firstName="Ada" initial={reference} />));
    await screen.findByRole("link", { name: new RegExp(`2026-07-05`) });
    expect(container.querySelector(`a[href*="${draft}"]`)).not.toBeNull();
    expect(undersized(container)).toEqual([]);
  });

  it("safety gate and start form", async () => {
    const gate = render(<SafetyGate><p>after</p></SafetyGate>);
    await screen.findByRole("button", { name: "I have read this and will take care" });
    expect(undersized(gate.container)).toEqual([]);
    gate.unmount();
    const { container } = render(<StartVisitForm transects={reference.transects} transectId={transectA} rules={reference.rules} onSaved={() => undefined} />);
    expect(undersized(container)).toEqual([]);
  });

  it("recording screen: sightings, confirmations, finishing and correcting", async () => {
    const visitId = await createVisit({ transectId: transectA, visitDate: "2026-07-05", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    await addSighting(visitId, { speciesId: meadowBrown, count: 2, section: 1, latitude: 52.1, longitude: 1.6, accuracyMetres: 8, note: null });
    const { container } = render(<RecordingScreen visitId={visitId} transectHint={transectA} transects={reference.transects} checklist={reference.checklist} seenByTransect={{}} rules={reference.rules} />);
    fireEvent.click(await screen.findByRole("button", { name: "Delete Meadow Brown" }));
    expect(screen.getByRole("button", { name: "Yes, delete it" })).toBeInTheDocument();
    expect(undersized(container)).toEqual([]);
    fireEvent.click(screen.getByRole("button", { name: "Keep it" }));
    fireEvent.click(screen.getByRole("button", { name: "Delete this walk" }));
    expect(undersized(container)).toEqual([]);
    fireEvent.click(screen.getByRole("button", { name: "Keep it" }));
    fireEvent.click(screen.getByRole("button", { name: "Finish the walk" }));
    expect(undersized(container)).toEqual([]);
    fireEvent.click(screen.getByRole("button", { name: "Back" }));
    fireEvent.click(screen.getByRole("button", { name: "Change visit details" }));
    await screen.findByRole("button", { name: "Save details" }, { timeout: 5000 });
    expect(undersized(container)).toEqual([]);
    fireEvent.click(screen.getByRole("button", { name: "Back" }));
    fireEvent.click(screen.getByRole("button", { name: "+ Add a sighting" }));
    fireEvent.change(await screen.findByRole("searchbox", { name: "Species" }, { timeout: 5000 }), { target: { value: "white" } }); // the form loads on first use
    expect(within(screen.getByRole("list", { name: "Matching species" })).getAllByRole("button").length).toBeGreaterThan(0);
    expect(undersized(container)).toEqual([]);

    await submitVisit(visitId, { endTime: "11:00", completeList: true, notes: null });
    await phoneStore().visits.update(visitId, { outbox: "needs-attention", attention: "Check the date." });
    await screen.findByRole("button", { name: "Correct it" });
    expect(undersized(container)).toEqual([]);
  });

  it("sighting form with a position and photos", async () => {
    const visitId = await createVisit({ transectId: transectA, visitDate: "2026-07-05", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    const id = await addSighting(visitId, { speciesId: meadowBrown, count: 2, section: 1, latitude: 52.1, longitude: 1.6, accuracyMetres: 8, note: null });
    await addPhoto(visitId, id, jpeg("a.jpg"));
    const editing = (await phoneStore().sightings.get(id))!;
    const { container } = render(<SightingForm visitId={visitId} checklist={reference.checklist} seenHere={[]} sectionCount={8} editing={editing} onDone={() => undefined} />);
    await screen.findByRole("button", { name: "Remove Photo 1" });
    fireEvent.change(screen.getByLabelText("Photos (optional)"), { target: { files: [jpeg("b.jpg")] } });
    expect(screen.getByRole("button", { name: "Remove the position" })).toBeInTheDocument();
    expect(undersized(container)).toEqual([]);
  });

  it("my records, with visits on the phone and a question to answer", async () => {
    await keepReference(reference);
    await createVisit({ transectId: transectA, visitDate: "2026-07-05", startTime: "10:00", temperatureC: null, windBeaufort: null, cloudCoverPercent: null, sky: null, coRecorders: null });
    vi.stubGlobal("fetch", vi.fn(async () => new Response(JSON.stringify({
      asOf: "2026-07-04T09:30:00.000Z",
      visits: [{ id: crypto.randomUUID(), visitDate: "2026-07-03", transectCode: "DUN-01", transectName: "North dunes", sightings: [
        { id: crypto.randomUUID(), vernacularName: "Small Blue", scientificName: "Cupido minimus", count: 1, section: 2, status: "queried", question: "Sure?", awaitingReply: true, conversation: [{ from: "checker", message: "Sure?", at: "2026-07-03T18:00:00.000Z" }] },
      ] }],
    }))));
    const { container } = render(withQueries(<MyRecords volunteerId="v1" />));
    await screen.findByRole("button", { name: "Send answer" });
    await screen.findByRole("link", { name: "Open this visit" });
    expect(undersized(container)).toEqual([]);
  });
});
