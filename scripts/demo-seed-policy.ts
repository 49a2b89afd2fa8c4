import { developmentDefaults, LOCAL_DATABASE_PASSWORD } from "@/lib/env";

// The demo's accounts share a password published in the README, so it goes only where it cannot
// be mistaken for a network's data: the project's own local cluster (scripts/services.sh), or
// wherever someone explicitly asks for it with --demo.

const LOOPBACK_HOSTS = new Set(["127.0.0.1", "localhost", "[::1]"]);

/** True for a database on the project's own cluster: loopback, its port and its password. */
export function isLocalClusterUrl(databaseUrl: string): boolean {
  try {
    const url = new URL(databaseUrl);
    const local = new URL(developmentDefaults.DATABASE_URL);
    return LOOPBACK_HOSTS.has(url.hostname) && url.port === local.port && decodeURIComponent(url.password) === LOCAL_DATABASE_PASSWORD;
  } catch {
    return false;
  }
}

/** Why the demo must not be seeded here, or null when it may. */
export function demoSeedRefusal(input: { databaseUrl: string; production: boolean; demoFlag: boolean }): string | null {
  if (input.demoFlag) return null;
  if (input.production) return "TURNSTONE_ENV is production";
  if (!isLocalClusterUrl(input.databaseUrl)) return "DATABASE_URL names a database outside this project's local cluster";
  return null;
}
