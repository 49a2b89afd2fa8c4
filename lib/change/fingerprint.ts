// A fingerprint of a prepared comparison, so chunk counts computed elsewhere (another
// thread, process or machine) are only combined when they came from the same data,
// site order and settings: counts are indexed by site position and mean nothing otherwise.
import type { PreparedPair, ResolvedOptions } from "./types";

/**
 * Two 32-bit hashes run side by side over the same bytes, printed together as 16 hex digits. The
 * first is 32-bit FNV-1a (Fowler, Noll and Vo's offset basis and prime); the second starts from
 * the upper half of FNV's 64-bit offset basis, uses the same 32-bit prime and mixes in the first's
 * top byte as well. Together they are not the 64-bit FNV-1a function, and nothing here is
 * cryptographic: it guards against mix-ups, not against anyone forging counts.
 */
export function hashPair() {
  let h1 = 0x811c9dc5;
  let h2 = 0xcbf29ce4;
  return {
    add(u8: Uint8Array) {
      for (let i = 0; i < u8.length; i++) {
        h1 = Math.imul(h1 ^ u8[i]!, 0x01000193);
        h2 = Math.imul(h2 ^ u8[i]! ^ (h1 >>> 24), 0x01000193);
      }
    },
    hex: () => (h1 >>> 0).toString(16).padStart(8, "0") + (h2 >>> 0).toString(16).padStart(8, "0"),
  };
}

export function fingerprintComparison(prepared: PreparedPair, options: ResolvedOptions): string {
  const hash = hashPair();
  const bytes = (view: ArrayBufferView) => hash.add(new Uint8Array(view.buffer, view.byteOffset, view.byteLength));
  const text = (s: string) => hash.add(new TextEncoder().encode(`${s.length}:${s}`));
  text(JSON.stringify([options.index, options.mode, options.seed, prepared.sites, prepared.species]));
  bytes(prepared.colStart);
  bytes(prepared.cellSite);
  bytes(prepared.before);
  bytes(prepared.after);
  return hash.hex();
}
