import "@testing-library/jest-dom/vitest";
import { Blob, File } from "node:buffer";
// jsdom's Blob lacks what fake-indexeddb's structured clone needs; use Node's.
globalThis.Blob = Blob as unknown as typeof globalThis.Blob;
globalThis.File = File as unknown as typeof globalThis.File;

import { cleanup } from "@testing-library/react";
import { afterEach } from "vitest";
// Without vitest globals, Testing Library cannot register its own cleanup.
afterEach(() => cleanup());
