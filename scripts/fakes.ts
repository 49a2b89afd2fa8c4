// Local stand-ins for hosted services: an S3-compatible store and an SMTP server that
// keeps every message it receives as .eml files. Loopback only; for development and tests.
import { mkdirSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { createServer } from "node:http";
import path from "node:path";
import { simpleParser } from "mailparser";
import S3rver from "s3rver";
import { SMTPServer } from "smtp-server";

const root = path.resolve(import.meta.dirname, "..");
const s3Port = Number(process.env.TURNSTONE_S3_PORT ?? 54330);
const smtpPort = Number(process.env.TURNSTONE_SMTP_PORT ?? 54331);
const mailApiPort = Number(process.env.TURNSTONE_MAIL_API_PORT ?? 54332);
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

// Read-only inbox of the SMTP fake as JSON, so tests in any checkout can read what was sent.
const inbox = createServer((req, res) => {
  if (req.method !== "GET" || req.url !== "/messages") {
    res.writeHead(404).end();
    return;
  }
  void (async () => {
    const files = readdirSync(mailDir).filter((f) => f.endsWith(".eml")).sort();
    const messages = await Promise.all(
      files.map(async (file) => {
        const m = await simpleParser(readFileSync(path.join(mailDir, file)));
        const to = Array.isArray(m.to) ? m.to.flatMap((a) => a.value) : (m.to?.value ?? []);
        return { file, to: to.map((a) => a.address), subject: m.subject ?? "", text: m.text ?? "", date: m.date?.toISOString() ?? null };
      }),
    );
    res.writeHead(200, { "Content-Type": "application/json" }).end(JSON.stringify(messages));
  })().catch(() => res.writeHead(500).end());
});
inbox.listen(mailApiPort, "127.0.0.1");

console.log(`S3 fake on http://127.0.0.1:${s3Port} (${s3Dir}); SMTP fake on 127.0.0.1:${smtpPort} (${mailDir}), its inbox as JSON on http://127.0.0.1:${mailApiPort}/messages`);

const stop = () => {
  smtp.close(() => undefined);
  inbox.close();
  void s3.close().finally(() => process.exit(0));
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
