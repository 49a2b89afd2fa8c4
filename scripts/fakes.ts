// Local stand-ins for hosted services: an S3-compatible store and an SMTP server that
// keeps every message it receives as .eml files. Loopback only; for development and tests.
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";

const root = path.resolve(import.meta.dirname, "..");
const s3Port = Number(process.env.TURNSTONE_S3_PORT ?? 54330);
const smtpPort = Number(process.env.TURNSTONE_SMTP_PORT ?? 54331);
const s3Dir = path.join(root, ".data", "s3");
const mailDir = process.env.MAIL_SPOOL_DIR ?? path.join(root, ".data", "mail");
mkdirSync(s3Dir, { recursive: true });
mkdirSync(mailDir, { recursive: true });

// Browsers upload photos straight to the store with presigned PUTs, so the fake must answer CORS.
const cors = `<CORSConfiguration><CORSRule><AllowedOrigin>*</AllowedOrigin><AllowedMethod>GET</AllowedMethod><AllowedMethod>PUT</AllowedMethod><AllowedMethod>HEAD</AllowedMethod><AllowedHeader>*</AllowedHeader><ExposeHeader>ETag</ExposeHeader><MaxAgeSeconds>3000</MaxAgeSeconds></CORSRule></CORSConfiguration>`;
const buckets = ["turnstone-photos", "turnstone-test-photos", ...(process.env.S3_BUCKET ? [process.env.S3_BUCKET] : [])];

const s3 = new S3rver({
  port: s3Port,
  address: "127.0.0.1",
  directory: s3Dir,
  silent: true,
  configureBuckets: [...new Set(buckets)].map((name) => ({ name, configs: [cors] })),
});
await s3.run();

let counter = 0;
const smtp = new SMTPServer({
  authOptional: true,
  disabledCommands: ["STARTTLS"],
  logger: false,
  onData(stream, session, callback) {
    const chunks: Buffer[] = [];
    stream.on("data", (c: Buffer) => chunks.push(c));
    stream.on("end", () => {
      const name = `${Date.now()}-${process.pid}-${counter++}.eml`;
      writeFileSync(path.join(mailDir, name), Buffer.concat(chunks));
      callback();
    });
  },
});
smtp.listen(smtpPort, "127.0.0.1");

console.log(`S3 fake on http://127.0.0.1:${s3Port} (${s3Dir}); SMTP fake on 127.0.0.1:${smtpPort} (${mailDir})`);

const stop = () => {
  smtp.close(() => undefined);
  void s3.close().finally(() => process.exit(0));
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
