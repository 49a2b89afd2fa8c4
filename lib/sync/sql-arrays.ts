import { sql, type SQL } from "drizzle-orm";

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * A list of UUIDs as ONE uuid[] parameter (`col = any(...)`), unlike drizzle's inArray which
 * sends one parameter per id: the statement text then stays the same for every batch size.
 */
export function uuidArray(ids: readonly string[]): SQL {
  for (const id of ids) if (!UUID.test(id)) throw new TypeError("uuidArray takes validated UUIDs only");
  return sql`${`{${ids.join(",")}}`}::uuid[]`;
}
