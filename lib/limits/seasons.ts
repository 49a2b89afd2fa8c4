// Season rules' numbers, shared by the settings form, its server schema and the database check.
import type { Range } from "./counts";

/** Days after closing during which late walks and late checking are still taken. Our choice of bounds. */
export const SEASON_GRACE_DAYS: Range = { min: 0, max: 365 };

/** The grace period when an organiser has not chosen one. */
export const DEFAULT_SEASON_GRACE_DAYS = 30;
