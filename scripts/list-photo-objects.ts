// Writes the photo store's object list as JSON to stdout, for npm run db:backup: what the
// database's photo rows point at, to check a restored copy against the store (or a store's
// restored version against the database). The objects themselves stay in the store.
import "./server-conditions";
import "./load-env";
import { photoBucket, s3 } from "@/lib/storage/s3";
import { listObjects } from "./photo-objects";
import { requireEnv } from "./require-env";

requireEnv();
const listedAt = new Date().toISOString();
const bucket = photoBucket();
const objects = await listObjects(s3(), { bucket });
process.stdout.write(`${JSON.stringify({ bucket, listedAt, count: objects.length, objects }, null, 2)}\n`);
s3().destroy();
