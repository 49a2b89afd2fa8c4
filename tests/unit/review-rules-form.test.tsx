import { fireEvent, render, screen, waitFor } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { ReviewRulesForm } from "@/app/(network)/network/review-rules/review-rules-form";
import { NetworkProviders } from "@/components/network/network-providers";
import { DEFAULT_WALK_RULES } from "@/lib/review/walk-rules";
import { DEFAULT_WARNING_RULES } from "@/lib/review/warning-rules";

// The organiser's walk rules and warnings form: the server's schema checks it before anything is
// sent, and the server's field messages land on the fields.

const saved = { walkRules: { ...DEFAULT_WALK_RULES, maxWindBeaufort: 4 }, warningRules: DEFAULT_WARNING_RULES };

function renderForm(rules = { walkRules: DEFAULT_WALK_RULES, warningRules: DEFAULT_WARNING_RULES }) {
  render(
    <NetworkProviders>
      <ReviewRulesForm rules={rules} />
    </NetworkProviders>,
  );
}
const set = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });
const saveButton = () => screen.getByRole("button", { name: "Save the rules" });

afterEach(() => vi.unstubAllGlobals());

describe("the walk rules and warnings form", () => {
  it("shows the network's rules, and saves a change with PUT, saying how many walks and sightings are marked differently", async () => {
    const fetchMock = vi.fn(async () => Response.json({ ...saved, walksRejudged: 7, sightingsRejudged: 0 }));
    vi.stubGlobal("fetch", fetchMock);
    renderForm();
    expect(screen.getByLabelText("Start no earlier than")).toHaveValue("10:45");
    expect(screen.getByLabelText("End no later than")).toHaveValue("15:45");
    expect(screen.getByLabelText("Lowest temperature (°C)")).toHaveValue(13);
    expect(screen.getByLabelText("Strongest wind (Beaufort force)")).toHaveValue("5");
    expect(screen.getByLabelText("Walks in rain (light or heavy) are inside the rules")).not.toBeChecked();
    expect(screen.getByLabelText("Earlier seasons needed")).toHaveValue(2);
    expect(saveButton()).toBeDisabled(); // nothing changed yet

    set("Strongest wind (Beaufort force)", "4");
    fireEvent.click(saveButton());
    expect(await screen.findByRole("status")).toHaveTextContent("Saved. 7 walks and 0 sightings are marked differently now.");
    const [url, init] = fetchMock.mock.calls[0] as unknown as [string, RequestInit];
    expect(url).toBe("/api/network/settings/review-rules");
    expect(init.method).toBe("PUT");
    expect(JSON.parse(init.body as string)).toEqual(saved);
  });

  it("refuses a window that ends before it starts and an empty or broken threshold, sending nothing", async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal("fetch", fetchMock);
    renderForm();
    set("Start no earlier than", "15:00");
    set("End no later than", "14:00");
    set("Smallest count warned of", "");
    set("Times the earlier highest", "0.5");
    fireEvent.click(saveButton());
    expect(await screen.findByText("The window must end after it starts")).toBeInTheDocument();
    expect(screen.getByLabelText("Smallest count warned of")).toHaveAttribute("aria-invalid", "true");
    expect(screen.getByLabelText("Times the earlier highest")).toHaveAttribute("aria-invalid", "true");
    expect(screen.getByLabelText("Lowest temperature (°C)")).not.toHaveAttribute("aria-invalid");
    expect(fetchMock).not.toHaveBeenCalled();
  });

  it("puts the server's field messages on their fields and says nothing was saved", async () => {
    vi.stubGlobal("fetch", vi.fn(async () => Response.json({ error: { code: "invalid", message: "Check the marked fields.", fields: { "walkRules.coolMinimumC": ["Not that cold."] } } }, { status: 400 })));
    renderForm();
    set("Lowest temperature (°C)", "12");
    fireEvent.click(saveButton());
    expect(await screen.findByText("Not that cold.")).toBeInTheDocument();
    expect(screen.getByRole("alert")).toHaveTextContent("Nothing was saved: correct the marked fields.");
  });

  it("fills in the starting values without saving them", async () => {
    const fetchMock = vi.fn();
    vi.stubGlobal("fetch", fetchMock);
    renderForm({ walkRules: { ...DEFAULT_WALK_RULES, windowStart: "09:30", rainAllowed: true }, warningRules: { countFactor: 5, countMinimum: 20, firstRecordMinSeasons: 3 } });
    expect(screen.getByLabelText("Start no earlier than")).toHaveValue("09:30");
    fireEvent.click(screen.getByRole("button", { name: "Fill in the starting values" }));
    await waitFor(() => expect(screen.getByLabelText("Start no earlier than")).toHaveValue("10:45"));
    expect(screen.getByLabelText("Walks in rain (light or heavy) are inside the rules")).not.toBeChecked();
    expect(screen.getByLabelText("Times the earlier highest")).toHaveValue(3);
    expect(saveButton()).toBeEnabled();
    expect(fetchMock).not.toHaveBeenCalled();
  });
});
