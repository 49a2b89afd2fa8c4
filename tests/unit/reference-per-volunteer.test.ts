import "fake-indexeddb/auto";
import { beforeEach, describe, expect, it } from "vitest";
import { PhoneStore, setPhoneStore, setFieldUser } from "@/lib/offline/phone-store";
import { keepReference, phoneReference, type FieldReference } from "@/lib/offline/reference";

const alice = "3d5e7f90-1a2b-4c3d-8e4f-5a6b7c8d9e0f";
const bruno = "9a8b7c6d-5e4f-4a3b-8c2d-1e0f9a8b7c6d";
const copy = (savedAt: string) => ({ savedAt, transects: [], checklist: [], seenByTransect: {}, rules: {} }) as unknown as FieldReference;

describe("the phone's copy of a volunteer's transects and checklist", () => {
  beforeEach(() => {
    setPhoneStore(new PhoneStore(`test-${crypto.randomUUID()}`));
  });

  it("is kept per volunteer, so a shared phone never shows one volunteer's transects to the next", async () => {
    setFieldUser(alice);
    await keepReference(copy("2026-06-01T08:00:00.000Z"));
    setFieldUser(bruno);
    expect(await phoneReference()).toBeNull();
    await keepReference(copy("2026-06-02T08:00:00.000Z"));
    setFieldUser(alice);
    expect((await phoneReference())?.savedAt).toBe("2026-06-01T08:00:00.000Z");
  });

  it("keeps the newer of two copies", async () => {
    setFieldUser(alice);
    await keepReference(copy("2026-06-02T08:00:00.000Z"));
    await keepReference(copy("2026-06-01T08:00:00.000Z"));
    expect((await phoneReference())?.savedAt).toBe("2026-06-02T08:00:00.000Z");
  });
});
