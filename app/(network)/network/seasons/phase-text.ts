import type { SeasonRow } from "./api";

// How each phase reads on the seasons page: what it is called and what it means for volunteers.

const day = (iso: string) => new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric" });

export function phaseLabel(season: Pick<SeasonRow, "phase">): string {
  switch (season.phase) {
    case "planning":
      return "Being planned";
    case "open":
      return "Open for walks";
    case "grace":
      return "Closed, late walks still taken";
    case "frozen":
      return "Closed and frozen";
  }
}

export function phaseHelp(season: Pick<SeasonRow, "phase" | "graceEndsAt">): string {
  switch (season.phase) {
    case "planning":
      return "Volunteers cannot record yet. Dates can still change.";
    case "open":
      return "Volunteers record walks dated inside the season.";
    case "grace":
      return `Walks from the season and their review are taken until ${season.graceEndsAt ? day(season.graceEndsAt) : "the grace period ends"}.`;
    case "frozen":
      return "Sightings are final: only an organiser can correct one, and the correction is logged.";
  }
}
