// Reads the image sizes a HEIF/HEIC file declares, straight from its boxes and without decoding,
// so that inspectPhoto can refuse decompression bombs before any decoder allocates pixels.
// Box layout per ISO/IEC 14496-12 (ISO-BMFF) and ISO/IEC 23008-12 (HEIF): meta > iprp > ipco > ispe.

export type DeclaredSize = { width: number; height: number };

type Box = { type: string; start: number; end: number };

/** The boxes laid end to end between start and end; stops quietly at anything malformed. */
function* boxesIn(view: DataView, start: number, end: number): Generator<Box> {
  let offset = start;
  while (offset + 8 <= end) {
    let size = view.getUint32(offset);
    const type = String.fromCharCode(view.getUint8(offset + 4), view.getUint8(offset + 5), view.getUint8(offset + 6), view.getUint8(offset + 7));
    let header = 8;
    if (size === 1) {
      if (offset + 16 > end) return;
      size = Number(view.getBigUint64(offset + 8));
      header = 16;
    } else if (size === 0) {
      size = end - offset; // "extends to the end of its container"
    }
    if (size < header || offset + size > end) return;
    yield { type, start: offset + header, end: offset + size };
    offset += size;
  }
}

function find(view: DataView, parent: Box, type: string): Box | undefined {
  for (const box of boxesIn(view, parent.start, parent.end)) if (box.type === type) return box;
  return undefined;
}

/**
 * Every 'ispe' (image spatial extents) property in the file: one per coded image, grid tile,
 * thumbnail or auxiliary image. ispe is the size before rotation, mirroring or cropping, so it is
 * what a decoder allocates; a crop ('clap') can make the shown size much smaller than that.
 */
export function heifImageSizes(bytes: Uint8Array): DeclaredSize[] {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const meta = find(view, { type: "file", start: 0, end: bytes.byteLength }, "meta");
  // meta is a FullBox: version and flags (4 bytes) come before its children.
  const iprp = meta && find(view, { ...meta, start: meta.start + 4 }, "iprp");
  const ipco = iprp && find(view, iprp, "ipco");
  if (!ipco) return [];
  const sizes: DeclaredSize[] = [];
  for (const box of boxesIn(view, ipco.start, ipco.end)) {
    // ispe is a FullBox too: version and flags, then width and height as 32-bit integers.
    if (box.type === "ispe" && box.end - box.start >= 12) {
      sizes.push({ width: view.getUint32(box.start + 4), height: view.getUint32(box.start + 8) });
    }
  }
  return sizes;
}
