"use client";

import { useState } from "react";
import { localToday, mondayOf } from "@/lib/effort/weeks";
import { openSeasonOn, type FieldSeason } from "@/lib/field/season-dates";
import { phoneStore } from "@/lib/offline/phone-store";
import { syncNow } from "@/lib/offline/sync-controller";
import { reportWeatherMiss, withdrawWeatherMiss } from "@/lib/offline/weather";
import { useFieldUserId } from "./field-providers";
import { useLive } from "./use-live";

export const WEATHER_BUTTON = "Not walked this week: bad weather";

const stateWords = {
  "on-phone": "On this phone, sent when there is signal.",
  sending: "Sending…",
  sent: "Sent.",
  "needs-attention": "Sent back:",
} as const;

/**
 * One tap on the field home: "not walked this week because of the weather" for one transect.
 * Stored on the phone first (no signal needed) and sent by the outbox. It can be taken back while
 * it is still on the phone or was refused, not once the server has it.
 */
export function WeatherReport({ transectId, transectCode, seasons }: { transectId: string; transectCode: string; seasons: readonly FieldSeason[] | undefined }) {
  const userId = useFieldUserId();
  const today = localToday();
  const weekStart = mondayOf(today);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const report = useLive(
    async () =>
      userId
        ? ((await phoneStore()
            .weatherMisses.where("ownerId")
            .equals(userId)
            .filter((m) => m.transectId === transectId && m.weekStart === weekStart)
            .first()) ?? null)
        : null,
    [userId, transectId, weekStart],
  );

  const act = async (work: () => Promise<unknown>) => {
    setBusy(true);
    setError(null);
    try {
      await work();
    } catch (e) {
      setError(e instanceof Error ? e.message : "That did not work on this phone.");
    } finally {
      setBusy(false);
    }
  };

  // Rendered in the browser only (the store answers after mount), so `today` is the phone's own day.
  if (report === undefined) return null;
  if (!report) {
    // The server takes reports only in an open season; a copy saved before seasons were sent leaves it to the server.
    if (seasons && !openSeasonOn(seasons, today)) return null;
    return (
      <div className="mt-2">
        <button
          type="button"
          className="btn-quiet min-h-tap min-w-tap w-full"
          aria-label={`${WEATHER_BUTTON} (${transectCode})`}
          disabled={busy}
          onClick={() =>
            void act(async () => {
              await reportWeatherMiss(transectId, today);
              void syncNow();
            })
          }
        >
          {WEATHER_BUTTON}
        </button>
        {error && <p role="alert" className="field-error">{error}</p>}
      </div>
    );
  }
  const undoable = report.outbox === "on-phone" || report.outbox === "needs-attention";
  return (
    <div className="mt-2 rounded-lg bg-shingle-50 p-2 text-sm" data-testid="weather-report">
      <p role="status">
        <strong>Reported: not walked this week because of the weather</strong> (week of {report.weekStart}). {stateWords[report.outbox]}
        {report.outbox === "needs-attention" && report.attention && ` ${report.attention}`}
      </p>
      {undoable && (
        <button
          type="button"
          className="btn-quiet mt-2 min-h-tap min-w-tap w-full"
          aria-label={`Take back the weather report (${transectCode})`}
          disabled={busy}
          onClick={() => void act(() => withdrawWeatherMiss(report.id))}
        >
          Take it back
        </button>
      )}
      {error && <p role="alert" className="field-error">{error}</p>}
    </div>
  );
}
