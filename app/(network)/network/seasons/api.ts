// The seasons page's query keys and the overview's shape as it arrives over JSON.
import type { SeasonPhase } from "@/lib/seasons/rules";
export { api, ApiError } from "@/components/network/api";

export const seasonKeys = {
  overview: ["network", "seasons"] as const,
};

export type SeasonRow = {
  id: string;
  name: string;
  startsOn: string;
  endsOn: string;
  status: "planning" | "open" | "closed";
  targetVisits: number;
  minVisits: number;
  phase: SeasonPhase;
  graceEndsAt: string | null;
  walks: number;
};

export type SeasonsOverview = { seasons: SeasonRow[]; graceDays: number };
