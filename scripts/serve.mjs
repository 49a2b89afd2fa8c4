// Serves the built app with one `next start` process per CPU core (WEB_CONCURRENCY overrides).
// A Node process uses one core for JavaScript; with one per core, the cluster module shares the
// listening socket and hands each new connection to the next process in turn.
// Usage: node scripts/serve.mjs [next start options, e.g. -p 3000]
import cluster from "node:cluster";
import { createRequire } from "node:module";
import { availableParallelism } from "node:os";

const require = createRequire(import.meta.url);
const requested = Number(process.env.WEB_CONCURRENCY ?? availableParallelism());
const processes = Number.isInteger(requested) && requested > 0 ? requested : 1;
const RESTART_WINDOW_MS = 60_000;
const MAX_RESTARTS_IN_WINDOW = 5;

let stopping = false;
const restarts = [];

cluster.setupPrimary({
  exec: require.resolve("next/dist/bin/next"),
  args: ["start", ...process.argv.slice(2)],
  // A larger young generation means fewer garbage collection pauses for a server that makes
  // many short-lived objects per request (V8's default tops out at 16 MB).
  execArgv: [...process.execArgv, "--max-semi-space-size=32"],
});
for (let i = 0; i < processes; i++) cluster.fork();
console.log(`[turnstone] serving with ${processes} app process${processes === 1 ? "" : "es"} (WEB_CONCURRENCY to change)`);

cluster.on("exit", (worker, code, signal) => {
  if (stopping) {
    if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
    return;
  }
  // Replace a crashed process, but stop instead of looping if they keep dying (a bad build, a taken port).
  const now = Date.now();
  restarts.push(now);
  while (restarts.length && now - restarts[0] > RESTART_WINDOW_MS) restarts.shift();
  if (restarts.length > MAX_RESTARTS_IN_WINDOW) {
    console.error(`[turnstone] app processes keep exiting (last: code ${code}, signal ${signal}); stopping`);
    stop("SIGTERM", 1);
    return;
  }
  console.error(`[turnstone] app process ${worker.process.pid} exited (code ${code}, signal ${signal}); starting another`);
  cluster.fork();
});

function stop(signal, exitCode = 0) {
  stopping = true;
  const workers = Object.values(cluster.workers ?? {});
  if (workers.length === 0) process.exit(exitCode);
  for (const worker of workers) worker?.process.kill(signal);
  // Give them time to finish requests in flight, then make sure nothing is left behind.
  setTimeout(() => {
    for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill("SIGKILL");
    process.exit(exitCode);
  }, 10_000).unref();
}

process.on("SIGTERM", () => stop("SIGTERM"));
process.on("SIGINT", () => stop("SIGTERM"));
