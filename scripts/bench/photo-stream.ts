// The photo side of bench:sync: simulated phones that send HEIC photos through the real flow
// (POST /api/field/photos for a ticket, PUT straight to the object store, POST .../complete),
// one after another, while the other phones sync. The fixtures are the phone HEICs in
// tests/fixtures, the 12-megapixel one among them (a 0.4–2 s decode each).
import { randomUUID } from "node:crypto";
import { readFileSync, readdirSync } from "node:fs";
import path from "node:path";
import { DeleteObjectCommand, S3Client } from "@aws-sdk/client-s3";
import type postgres from "postgres";
import type { Env } from "../../lib/env";

export type PhotoSender = { cookie: string; visitId: string };
export type PhotoFixture = { name: string; bytes: Buffer };
/** ms: the completion request alone; endedAt: when it answered, on performance.now()'s clock. */
export type PhotoCompletion = { fixture: string; status: number; code?: string; ms: number; endedAt: number };

const FIXTURES = path.resolve(import.meta.dirname, "..", "..", "tests", "fixtures");

export function heicFixtures(): PhotoFixture[] {
  const names = readdirSync(FIXTURES).filter((name) => name.endsWith(".heic")).sort();
  if (names.length === 0) throw new Error(`no .heic fixtures in ${FIXTURES}`);
  return names.map((name) => ({ name, bytes: readFileSync(path.join(FIXTURES, name)) }));
}

/** One photo through ticket, PUT and completion; the completion's time is what is measured. */
export async function sendPhoto(baseUrl: string, sender: PhotoSender, fixture: PhotoFixture): Promise<PhotoCompletion> {
  const id = randomUUID();
  const ticket = await fetch(`${baseUrl}/api/field/photos`, {
    method: "POST",
    headers: { "content-type": "application/json", cookie: sender.cookie },
    body: JSON.stringify({ id, visitId: sender.visitId, sightingId: null, contentType: "image/heic", bytes: fixture.bytes.length }),
  });
  if (ticket.status !== 200) throw new Error(`photo ticket answered HTTP ${ticket.status}: ${(await ticket.text()).slice(0, 200)}`);
  const { uploadUrl, headers } = (await ticket.json()) as { uploadUrl: string; headers: Record<string, string> };
  const put = await fetch(uploadUrl, { method: "PUT", headers, body: new Uint8Array(fixture.bytes) });
  if (put.status !== 200) throw new Error(`photo PUT to the store answered HTTP ${put.status}`);
  const start = performance.now();
  const done = await fetch(`${baseUrl}/api/field/photos/${id}/complete`, { method: "POST", headers: { cookie: sender.cookie } });
  const endedAt = performance.now();
  const body = (await done.json().catch(() => ({}))) as { error?: { code?: string } };
  return { fixture: fixture.name, status: done.status, ms: endedAt - start, endedAt, ...(body.error?.code ? { code: body.error.code } : {}) };
}

/**
 * Every sender sends the fixtures in turn, back to back, until stop() is called; stop resolves
 * with every completion once the photos in flight have finished.
 */
export function startPhotoStream(baseUrl: string, senders: PhotoSender[], fixtures: PhotoFixture[]) {
  let stopping = false;
  const completions: PhotoCompletion[] = [];
  const loops = senders.map(async (sender, s) => {
    for (let n = s; !stopping; n++) completions.push(await sendPhoto(baseUrl, sender, fixtures[n % fixtures.length]!));
  });
  return {
    completions,
    async stop(): Promise<PhotoCompletion[]> {
      stopping = true;
      await Promise.all(loops);
      return completions;
    },
  };
}

/**
 * Deletes the stored images of the given photo rows. The app's own store client is server-only
 * (lib/storage/s3.ts), so this one is made the same way from the same settings.
 */
export async function deletePhotoObjects(e: Env, keys: string[]): Promise<void> {
  if (keys.length === 0) return;
  const client = new S3Client({
    endpoint: e.S3_ENDPOINT,
    region: e.S3_REGION,
    forcePathStyle: e.S3_FORCE_PATH_STYLE,
    credentials: { accessKeyId: e.S3_ACCESS_KEY_ID, secretAccessKey: e.S3_SECRET_ACCESS_KEY },
  });
  try {
    for (let i = 0; i < keys.length; i += 8) {
      await Promise.all(keys.slice(i, i + 8).map((Key) => client.send(new DeleteObjectCommand({ Bucket: e.S3_BUCKET, Key }))));
    }
  } finally {
    client.destroy();
  }
}

/** Every object key the given volunteers' photos use (originals included, in case one is left). */
export async function photoKeysOf(sql: postgres.Sql, emailPattern: string): Promise<string[]> {
  const rows = await sql<{ key: string }[]>`
    select unnest(array[p.upload_key, p.display_key, p.thumbnail_key]) as key
    from photos p join users u on u.id = p.uploaded_by_id where u.email like ${emailPattern}`;
  return rows.map((r) => r.key).filter((key): key is string => key !== null);
}
