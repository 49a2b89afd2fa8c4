// Serves the built app with one process per CPU core (WEB_CONCURRENCY overrides). A Node process
// uses one core for JavaScript; with one per core, the cluster module shares the listening socket
// and hands each new connection to the next process in turn. Each process runs Next's request
// handler in a node:http server of its own (a custom server: next({ dev: false }) and
// getRequestHandler(), as in Next's "Custom Server" guide), so that every request carries the
// address of its TCP peer, which the client cannot choose (peer-address.mjs).
// Usage: node scripts/serve.mjs [-p PORT] [-H HOSTNAME] [--keepAliveTimeout MS]   (PORT also works)
import cluster from "node:cluster";
import http from "node:http";
import { availableParallelism } from "node:os";
import path from "node:path";
import { parseArgs } from "node:util";
import { withPeerAddress } from "./peer-address.mjs";

/** A configuration error (EX_CONFIG; scripts/require-env.ts): such a process is not replaced. */
const CONFIG_EXIT_CODE = 78;
const USAGE_EXIT_CODE = 2;
const RESTART_WINDOW_MS = 60_000;
const MAX_RESTARTS_IN_WINDOW = 5;
/** How long requests in flight may take to finish when the app is stopped. */
const STOP_GRACE_MS = 10_000;

function options() {
  const usage = "usage: node scripts/serve.mjs [-p PORT] [-H HOSTNAME] [--keepAliveTimeout MS]";
  try {
    const { values } = parseArgs({
      options: { port: { type: "string", short: "p" }, hostname: { type: "string", short: "H" }, keepAliveTimeout: { type: "string" } },
      strict: true,
      allowPositionals: false,
    });
    const port = Number(values.port ?? process.env.PORT ?? 3000);
    const keepAliveTimeout = values.keepAliveTimeout === undefined ? undefined : Number(values.keepAliveTimeout);
    if (!Number.isInteger(port) || port < 1 || port > 65535) throw new Error("the port must be a whole number from 1 to 65535");
    if (keepAliveTimeout !== undefined && !(Number.isInteger(keepAliveTimeout) && keepAliveTimeout > 0)) {
      throw new Error("--keepAliveTimeout must be a whole number of milliseconds");
    }
    return { port, hostname: values.hostname, keepAliveTimeout };
  } catch (error) {
    console.error(`[turnstone] ${error instanceof Error ? error.message : error}\n${usage}`);
    process.exit(USAGE_EXIT_CODE);
  }
}

const settings = options();

if (cluster.isPrimary) servePrimary();
else await serveProcess();

function servePrimary() {
  const requested = Number(process.env.WEB_CONCURRENCY ?? availableParallelism());
  const processes = Number.isInteger(requested) && requested > 0 ? requested : 1;
  let stopping = false;
  let exitCode = 0;
  const restarts = [];

  cluster.setupPrimary({
    // A larger young generation means fewer garbage collection pauses for a server that makes
    // many short-lived objects per request (V8's default tops out at 16 MB).
    execArgv: [...process.execArgv, "--max-semi-space-size=32"],
  });
  // One process first: a bad configuration or a taken port then shows once, not once per core.
  cluster.fork();
  cluster.once("listening", () => {
    for (let i = 1; i < processes; i++) cluster.fork();
    console.log(`[turnstone] serving on port ${settings.port} with ${processes} app process${processes === 1 ? "" : "es"} (WEB_CONCURRENCY to change)`);
  });

  cluster.on("exit", (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(exitCode);
      return;
    }
    if (code === CONFIG_EXIT_CODE) {
      console.error("[turnstone] an app process stopped on its configuration (see above); stopping");
      stop("SIGTERM", CONFIG_EXIT_CODE);
      return;
    }
    // Replace a crashed process, but stop instead of looping if they keep dying (a bad build).
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

  function stop(signal, code = 0) {
    stopping = true;
    exitCode = code;
    const workers = Object.values(cluster.workers ?? {});
    if (workers.length === 0) process.exit(exitCode);
    for (const worker of workers) worker?.process.kill(signal);
    // Give them time to finish requests in flight, then make sure nothing is left behind.
    setTimeout(() => {
      for (const worker of Object.values(cluster.workers ?? {})) worker?.process.kill("SIGKILL");
      process.exit(exitCode);
    }, STOP_GRACE_MS + 1000).unref();
  }

  process.on("SIGTERM", () => stop("SIGTERM"));
  process.on("SIGINT", () => stop("SIGTERM"));
}

async function serveProcess() {
  // As `next start` does: the built app runs in production mode unless told otherwise.
  process.env.NODE_ENV ||= "production";
  const { default: next } = await import("next");
  const app = next({ dev: false, dir: path.resolve(import.meta.dirname, ".."), hostname: settings.hostname, port: settings.port });
  // Runs instrumentation.ts's register(), which exits on a bad configuration.
  await app.prepare();
  const handle = app.getRequestHandler();
  const server = http.createServer(withPeerAddress((req, res) => handle(req, res)));
  if (settings.keepAliveTimeout) server.keepAliveTimeout = settings.keepAliveTimeout;
  server.on("error", (error) => {
    if (error.code === "EADDRINUSE") {
      console.error(`[turnstone] port ${settings.port} is in use: choose another with -p or PORT`);
      process.exit(CONFIG_EXIT_CODE);
    }
    console.error("[turnstone] the app's server failed:", error);
    process.exit(1);
  });
  server.listen(settings.port, settings.hostname);

  let closing = false;
  const close = () => {
    if (closing) return;
    closing = true;
    // Stop taking connections, let requests in flight finish (idle keep-alive connections are
    // closed at once), then let Next clean up.
    server.close(() => void app.close().finally(() => process.exit(0)));
    setTimeout(() => process.exit(0), STOP_GRACE_MS).unref();
  };
  process.on("SIGTERM", close);
  process.on("SIGINT", close);
}
