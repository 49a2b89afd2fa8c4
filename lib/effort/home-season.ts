// Which season the organiser's home shows: the open one; else the latest closed one (its effort
// is complete and worth seeing); else the latest being planned. Pure, so it is tested alone.

type Candidate = { status: "planning" | "open" | "closed"; startsOn: string };

export function homeSeason<S extends Candidate>(seasons: readonly S[]): S | null {
  const latest = (status: Candidate["status"]) =>
    seasons.filter((s) => s.status === status).reduce<S | null>((best, s) => (best === null || s.startsOn > best.startsOn ? s : best), null);
  return latest("open") ?? latest("closed") ?? latest("planning");
}
