// Next calls register() once when a server process starts, before it serves anything: a server
// with a configuration lib/env.ts refuses stops here with its one message (exit 78, which
// scripts/serve.mjs does not restart) instead of failing request by request.
export async function register() {
  if (process.env.NEXT_RUNTIME !== "nodejs") return;
  const { requireEnv } = await import("./scripts/require-env");
  requireEnv();
}
