import { AppError, invalid } from "@/lib/errors";

/**
 * What a write may carry. JSON by default: a cross-site HTML form can only send form or plain-text
 * bodies, so refusing those keeps forms on other sites away from the JSON routes whatever the
 * cookie settings. "form" is for a route that must take a form post (RFC 8058's one-click
 * unsubscribe) and says so in its own route() options.
 */
export type BodyKind = "json" | "form";

const mediaTypes: Record<BodyKind, readonly string[]> = {
  json: ["application/json"],
  form: ["application/x-www-form-urlencoded", "multipart/form-data"],
};

const writeMethods = new Set(["POST", "PUT", "PATCH", "DELETE"]);

export const isWrite = (request: Request) => writeMethods.has(request.method.toUpperCase());

export const tooLarge = (limit: number) =>
  new AppError(413, "too_large", `The request is too large: at most ${limit.toLocaleString("en-GB")} bytes are read here. Send less at a time.`);

export const unsupportedType = (kind: BodyKind) =>
  new AppError(
    415,
    "unsupported_media_type",
    kind === "json" ? "Send this request's body as JSON, with Content-Type: application/json." : "Send this request's body as a form (application/x-www-form-urlencoded or multipart/form-data).",
  );

/** The media type without parameters, lower-cased (media types are case-insensitive: RFC 9110 §8.3.1). */
function mediaTypeOf(request: Request): string | null {
  const header = request.headers.get("content-type");
  if (header === null) return null;
  return header.split(";", 1)[0]!.trim().toLowerCase();
}

/**
 * Refuses a write from its headers alone, before anything is read: a declared type other than
 * the route's (415), or a Content-Length over the cap (413). Content-Length only ever refuses:
 * what is accepted is what readBody counts.
 */
export function refuseByHeaders(request: Request, kind: BodyKind, limit: number): void {
  const type = mediaTypeOf(request);
  if (type !== null && !mediaTypes[kind].includes(type)) throw unsupportedType(kind);
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (Number.isFinite(declared) && declared > limit) throw tooLarge(limit);
}

/** Reads the body as a stream and stops past `limit` bytes (413), whatever the headers said. */
async function readCapped(request: Request, limit: number): Promise<Uint8Array<ArrayBuffer>> {
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      // Stop reading without tearing the connection down, so the 413 still reaches the client.
      reader.releaseLock();
      throw tooLarge(limit);
    }
    chunks.push(value);
  }
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, at);
    at += chunk.byteLength;
  }
  return bytes;
}

const notJson = () => invalid({ _: ["The request body is not valid JSON."] }, "The request body is not valid JSON.");

function parseJson(bytes: Uint8Array): unknown {
  let text: string;
  try {
    // JSON travels as UTF-8 (RFC 8259 §8.1); a broken byte is refused, not replaced.
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    throw notJson();
  }
  try {
    return JSON.parse(text);
  } catch {
    throw notJson();
  }
}

async function parseForm(request: Request, bytes: Uint8Array<ArrayBuffer>): Promise<Record<string, unknown>> {
  try {
    // The Fetch standard's own form parser, fed the bytes already counted.
    const form = await new Response(bytes, { headers: { "content-type": request.headers.get("content-type")! } }).formData();
    return Object.fromEntries(form);
  } catch {
    throw invalid({ _: ["The request body is not a valid form."] }, "The request body is not a valid form.");
  }
}

/**
 * A write's body, read with its cap: undefined when there is none (a photo completion, a cancel),
 * parsed JSON or form fields otherwise. A body with no declared type is refused (415).
 * Call refuseByHeaders first.
 */
export async function readBody(request: Request, kind: BodyKind, limit: number): Promise<unknown> {
  const bytes = await readCapped(request, limit);
  if (bytes.byteLength === 0) return undefined;
  if (mediaTypeOf(request) === null) throw unsupportedType(kind);
  return kind === "json" ? parseJson(bytes) : parseForm(request, bytes);
}
