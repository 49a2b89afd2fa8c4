import { localToday, mondayOf } from "@/lib/effort/weeks";
import { fieldUser, phoneStore, type LocalWeatherMiss } from "./phone-store";

// "Not walked this week because of the weather" on the phone: one tap on the field home stores a
// report here with no signal needed, and the outbox sends it with the next pass (the server's
// side: lib/sync/weather.ts). One report per transect and week: a second tap finds the first.

export const UNDO_TOO_LATE = "This report has already been sent, so it can no longer be taken back here.";

function signedIn(): string {
  const userId = fieldUser();
  if (!userId) throw new Error("Sign in to report a week not walked.");
  return userId;
}

/** This volunteer's report for the transect in the week holding `today`, if the phone has one. */
export async function weatherReportFor(userId: string, transectId: string, today: string = localToday()): Promise<LocalWeatherMiss | undefined> {
  const weekStart = mondayOf(today);
  return phoneStore()
    .weatherMisses.where("ownerId")
    .equals(userId)
    .filter((m) => m.transectId === transectId && m.weekStart === weekStart)
    .first();
}

/** Stores the report (offline too) and returns it; tapping again in the same week returns the one already there. */
export async function reportWeatherMiss(transectId: string, today: string = localToday()): Promise<LocalWeatherMiss> {
  const ownerId = signedIn();
  const db = phoneStore();
  return db.transaction("rw", db.weatherMisses, async () => {
    const existing = await weatherReportFor(ownerId, transectId, today);
    if (existing) return existing;
    const report: LocalWeatherMiss = {
      id: crypto.randomUUID(),
      ownerId,
      transectId,
      reportedOn: today,
      weekStart: mondayOf(today),
      clientUpdatedAt: new Date().toISOString(),
      outbox: "on-phone",
      attention: null,
      attempts: 0,
    };
    await db.weatherMisses.add(report);
    return report;
  });
}

/**
 * Takes a report back while the server has not got it: waiting on the phone, or refused by the
 * server. Once it is sending or sent it stays (the server keeps reports; a walk later that week
 * still counts, the effort grid shows the walk).
 */
export async function withdrawWeatherMiss(id: string): Promise<void> {
  const userId = signedIn();
  const db = phoneStore();
  await db.transaction("rw", db.weatherMisses, async () => {
    const report = await db.weatherMisses.get(id);
    if (!report || report.ownerId !== userId) return;
    if (report.outbox !== "on-phone" && report.outbox !== "needs-attention") throw new Error(UNDO_TOO_LATE);
    await db.weatherMisses.delete(id);
  });
}
