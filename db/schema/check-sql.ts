import { sql, type SQL } from "drizzle-orm";

/**
 * A number written into a check constraint's text. The limits come from lib/limits (one module
 * per limit, shared with the zod schemas and the forms); drizzle-kit would render an interpolated
 * value as a "$1" parameter, which a constraint cannot have.
 */
export const literal = (value: number): SQL => sql.raw(String(value));
