import "server-only";
import { MAX_PHOTO_PIXELS } from "./contract";

export type RawRgba = { data: Buffer; width: number; height: number; channels: 4 };

type Libheif = (typeof import("libheif-js/wasm-bundle"))["default"];
let loaded: Promise<Libheif> | undefined;

/** Loaded on the first HEIC only: compiling the 1.4 MB WebAssembly module takes a moment. */
function libheif(): Promise<Libheif> {
  loaded ??= import("libheif-js/wasm-bundle").then((module) => module.default);
  return loaded;
}

// libheif-js answers with either the thing asked for or a heif_error { code, subcode, message }.
function isError<T extends object>(value: T | { message: string }): value is { message: string } {
  return "message" in value;
}

/** Copies the interleaved RGBA plane out of WebAssembly memory, dropping any row padding. */
function copyRows(plane: { data: Uint8Array; stride: number }, width: number, height: number): Buffer {
  const rowBytes = width * 4;
  const out = Buffer.alloc(rowBytes * height);
  for (let row = 0; row < height; row++) out.set(plane.data.subarray(row * plane.stride, row * plane.stride + rowBytes), row * rowBytes);
  return out;
}

/**
 * Decodes the primary image of a HEIC (HEVC) to 8-bit RGBA with libheif and its libde265 HEVC
 * decoder compiled to WebAssembly (libheif-js), for servers whose libvips has no HEVC decoder.
 * libheif applies the file's 'irot'/'imir'/'clap' transforms by default, so the pixels come out
 * as the phone showed them. Only call after inspectPhoto has checked the declared sizes: the
 * decode runs synchronously (0.4–2 s for 12 MP, hence on a photo pool thread: pool.ts) and
 * allocates what the file declares. Throws Error when unreadable.
 */
export async function decodeHeic(bytes: Uint8Array): Promise<RawRgba> {
  const lib = await libheif();
  const context = lib.heif_context_alloc();
  try {
    const read = lib.heif_context_read_from_memory(context, bytes);
    if (read.code !== lib.heif_error_code.heif_error_Ok) throw new Error(`libheif: ${read.message}`);
    const handle = lib.heif_js_context_get_primary_image_handle(context);
    if (isError(handle)) throw new Error(`libheif: ${handle.message}`);
    try {
      const decoded = lib.heif_js_decode_image2(handle, lib.heif_colorspace.heif_colorspace_RGB, lib.heif_chroma.heif_chroma_interleaved_RGBA);
      if (isError(decoded)) throw new Error(`libheif: ${decoded.message}`);
      try {
        const { width, height } = decoded;
        const plane = decoded.channels.find((channel) => channel.id === lib.heif_channel.heif_channel_interleaved);
        if (!plane || width * height > MAX_PHOTO_PIXELS) throw new Error(`libheif: unexpected ${width} × ${height} image`);
        return { data: copyRows(plane, width, height), width, height, channels: 4 };
      } finally {
        lib.heif_image_release(decoded.image);
      }
    } finally {
      lib.heif_image_handle_release(handle);
    }
  } finally {
    lib.heif_context_free(context);
  }
}
