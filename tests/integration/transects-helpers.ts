// Shared by the transects-*.test.ts suites: calling route handlers as a signed-in person, and
// counting what the transect tables hold (a refused request must leave every count as it was).
import { readFileSync } from "node:fs";
import { eq, sql } from "drizzle-orm";
import { db } from "@/db/client";
import { users } from "@/db/schema";

type Handler = (request: Request, context: { params: Promise<never> }) => Promise<Response>;

export async function call(handler: Handler, options: { method?: string; body?: unknown; rawBody?: string; params?: Record<string, string>; contentType?: string } = {}) {
  const method = options.method ?? (options.body === undefined && options.rawBody === undefined ? "GET" : "POST");
  const body = options.rawBody ?? (options.body === undefined ? undefined : JSON.stringify(options.body));
  const headers: Record<string, string> = body === undefined ? {} : { "content-type": options.contentType ?? "application/json" };
  const response = await handler(new Request("http://localhost/api/network/test", { method, body, headers }), { params: Promise.resolve(options.params ?? {}) as Promise<never> });
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- answers are read loosely in tests
  return { status: response.status, json: (await response.json()) as Record<string, any> };
}

export async function userId(email: string): Promise<string> {
  const [u] = await db().select({ id: users.id }).from(users).where(eq(users.email, email));
  return u!.id;
}

export const demo = {
  organiser: "organiser@harrowmere.example",
  coordinator: "checker@harrowmere.example",
  partner: "partner@harrowmere.example",
  volunteer: "volunteer01@harrowmere.example",
};

export async function tableCounts() {
  const [row] = await db().execute<Record<string, number>>(sql`select
    (select count(*)::int from transects) as transects,
    (select count(*)::int from transect_route_versions) as versions,
    (select count(*)::int from transect_sections) as sections,
    (select count(*)::int from habitat_groups) as habitats,
    (select count(*)::int from network_changes) as changes`);
  return row!;
}

export const routeFixture = (name: string) => readFileSync(new URL(`../fixtures/routes/${name}`, import.meta.url), "utf8");

/** A habitat group id of the demo network. */
export async function habitatId(code = "CHK"): Promise<string> {
  const rows = await db().execute<{ id: string }>(sql`select id from habitat_groups where code = ${code}`);
  return rows[0]!.id;
}

export const details = (habitatGroupId: string, code: string) => ({ code, name: `Test transect ${code}`, habitatGroupId, sensitive: false, coastal: false });
