// A fingerprint of a prepared comparison, so chunk counts computed elsewhere (another
// thread, process or machine) are only combined when they came from the same data,
// site order and settings: counts are indexed by site position and mean nothing otherwise.
import type { PreparedPair, ResolvedOptions } from "./types";

/** 64-bit FNV-1a as two 32-bit halves; not cryptographic, it guards against mix-ups. */
export function fingerprintComparison(prepared: PreparedPair, options: ResolvedOptions): string {
  let h1 = 0x811c9dc5;
  let h2 = 0xcbf29ce4;
  const byte = (b: number) => {
    h1 = Math.imul(h1 ^ b, 0x01000193);
    h2 = Math.imul(h2 ^ b ^ (h1 >>> 24), 0x01000193);
  };
  const bytes = (view: ArrayBufferView) => {
    const u8 = new Uint8Array(view.buffer, view.byteOffset, view.byteLength);
    for (let i = 0; i < u8.length; i++) byte(u8[i]!);
  };
  const text = (s: string) => bytes(new TextEncoder().encode(`${s.length}:${s}`));
  text(JSON.stringify([options.index, options.mode, options.seed, prepared.sites, prepared.species]));
  bytes(prepared.colStart);
  bytes(prepared.cellSite);
  bytes(prepared.before);
  bytes(prepared.after);
  return (h1 >>> 0).toString(16).padStart(8, "0") + (h2 >>> 0).toString(16).padStart(8, "0");
}
