import { fireEvent, screen, waitFor, within } from "@testing-library/react";
import { afterEach, describe, expect, it, vi } from "vitest";
import { byId, posts, renderQueue, rows, serveApi } from "./review-fixtures";

vi.mock("next/navigation", async () => (await import("./review-navigation")).navigation);
vi.mock("@/components/review/queue/lazy-map", () => ({ SightingMap: ({ label }: { label: string }) => <div role="region" aria-label={label} /> }));

afterEach(() => vi.unstubAllGlobals());

/** A key pressed where the focus is (the page itself when nothing has it). */
const press = (key: string, target: Element = document.activeElement ?? document.body) => fireEvent.keyDown(target, { key });
const openId = () => screen.queryByTestId("sighting-detail")?.dataset.sightingId ?? null;
const rowButton = (id: string) => within(document.querySelector(`[data-row-id="${byId(id).id}"]`)!).getAllByRole("button")[0]!;

describe("the queue's keyboard shortcuts", () => {
  it("j and k (or the arrow keys) open the next and previous sighting, with the focus on its row", async () => {
    serveApi();
    await renderQueue();
    press("j");
    await waitFor(() => expect(openId()).toBe(rows[0]!.id));
    expect(document.activeElement).toBe(rowButton("a"));
    press("j");
    press("ArrowDown");
    await waitFor(() => expect(openId()).toBe(rows[2]!.id));
    expect(document.activeElement).toBe(rowButton("c"));
    press("k");
    await waitFor(() => expect(openId()).toBe(rows[1]!.id));
    press("ArrowUp");
    press("ArrowUp");
    await waitFor(() => expect(openId()).toBe(rows[0]!.id));
    expect(screen.getByTestId("review-announcement").textContent).toBe("This is the first sighting on this page.");
  });

  it("leaves letters alone in a text field", async () => {
    serveApi();
    await renderQueue();
    const search = screen.getByLabelText("Species");
    search.focus();
    press("j", search);
    press("?", search);
    expect(openId()).toBeNull();
    expect(screen.queryByRole("dialog")).toBeNull();
  });

  it("c confirms the open sighting and the next one opens, ready for the next key", async () => {
    const calls = serveApi({ action: (id) => ({ row: { ...rows.find((r) => r.id === id)!, status: "accepted", revision: 50 } }) });
    await renderQueue();
    fireEvent.click(rowButton("d"));
    await waitFor(() => expect(openId()).toBe(byId("d").id));
    press("c");
    await waitFor(() => expect(openId()).toBe(byId("e").id));
    expect(document.activeElement).toBe(rowButton("e"));
    press("c");
    await waitFor(() => expect(openId()).toBe(byId("f").id));
    expect(posts(calls).map((c) => c.body)).toEqual([
      { action: "accept", revision: 4 },
      { action: "accept", revision: 7 },
    ]);
  });

  it("q opens the question and s the set-aside form, each with the cursor in its first field", async () => {
    serveApi();
    await renderQueue();
    press("j");
    await waitFor(() => expect(openId()).toBe(rows[0]!.id));
    press("q");
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText("Your question")));
    // Typing q in the question is text, and Escape leaves the form.
    press("s", document.activeElement!);
    expect(screen.queryByRole("form", { name: /Set it aside/ })).toBeNull();
    press("Escape", document.activeElement!);
    await waitFor(() => expect(screen.queryByLabelText("Your question")).toBeNull());
    press("s", document.body);
    await waitFor(() => expect(document.activeElement).toBe(screen.getByLabelText("Reason")));
  });

  it("p opens the photo at display size; + and − zoom, → shows the next, Escape closes and gives the focus back", async () => {
    serveApi();
    await renderQueue();
    fireEvent.click(rowButton("e"));
    await screen.findByRole("button", { name: "Enlarge photo 1 of 2" });
    const before = document.activeElement;
    press("p", document.body);
    const dialog = await screen.findByRole("dialog", { name: "Photo 1 of 2: Marbled White" });
    expect(dialog).toHaveAttribute("aria-modal", "true");
    const image = within(dialog).getByRole("img");
    expect(image).toHaveAttribute("src", "https://photos.example.invalid/display/e1.jpg");
    expect(image.dataset.zoom).toBe("1");
    press("+");
    press("+");
    expect(image.dataset.zoom).toBe("2");
    fireEvent.click(within(dialog).getByRole("button", { name: "Zoom out" }));
    expect(image.dataset.zoom).toBe("1.5");
    // Shortcuts of the list are off while the dialog is open.
    press("j");
    expect(openId()).toBe(byId("e").id);
    press("ArrowRight");
    expect(screen.getByRole("dialog", { name: "Photo 2 of 2: Marbled White" })).toBeInTheDocument();
    expect(within(screen.getByRole("dialog")).getByRole("img")).toHaveAttribute("src", "https://photos.example.invalid/display/e2.jpg");
    press("Escape");
    await waitFor(() => expect(screen.queryByRole("dialog")).toBeNull());
    expect(document.activeElement).toBe(before);
  });

  it("? lists every shortcut in a dialog that keeps the focus inside until Escape", async () => {
    serveApi();
    await renderQueue();
    press("?");
    const help = await screen.findByRole("dialog", { name: "Keyboard shortcuts" });
    const text = help.textContent ?? "";
    for (const what of ["Next sighting", "Previous sighting", "Confirm the open sighting", "Ask the volunteer a question", "Set it aside", "Open its first photo", "Show this list", "Close a dialog"]) expect(text).toContain(what);
    const close = within(help).getByRole("button", { name: /Close/ });
    expect(document.activeElement).toBe(close);
    // The only control: Tab and Shift+Tab stay on it.
    fireEvent.keyDown(close, { key: "Tab" });
    expect(document.activeElement).toBe(close);
    fireEvent.keyDown(close, { key: "Tab", shiftKey: true });
    expect(document.activeElement).toBe(close);
    press("Escape");
    await waitFor(() => expect(screen.queryByRole("dialog")).toBeNull());
  });
});
