// Waits until a URL answers 2xx, for at most N seconds; exits 1 if it never does.
const [url, seconds = "60"] = process.argv.slice(2);
const deadline = Date.now() + Number(seconds) * 1000;
while (Date.now() < deadline) {
  try {
    const res = await fetch(url, { signal: AbortSignal.timeout(5000) });
    if (res.ok) process.exit(0);
  } catch {}
  await new Promise((r) => setTimeout(r, 500));
}
process.exit(1);
