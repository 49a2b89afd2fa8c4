"use client";

import { belongsTo, phoneStore } from "@/lib/offline/phone-store";
import { visitsStillOnPhone, type VisitOnPhone } from "@/lib/offline/records";
import { referenceKey, type FieldReference } from "@/lib/offline/reference";
import { useFieldUserId } from "../field-providers";
import { useLive } from "../use-live";

/** Where a walk still on the phone stands, in the volunteer's words. */
export function phoneStateOf({ visit, photosWaiting }: VisitOnPhone): { label: string; detail: string | null; urgent: boolean } {
  if (visit.phase === "draft") {
    return visit.attention
      ? { label: "Being corrected", detail: `Sent back: ${visit.attention}`, urgent: true }
      : { label: "Walk in progress", detail: "Not submitted yet.", urgent: false };
  }
  if (visit.outbox === "needs-attention") return { label: "Needs attention", detail: visit.attention, urgent: true };
  if (visit.outbox === "sending") return { label: "Sending", detail: null, urgent: false };
  if (visit.outbox === "sent") return { label: "Photos waiting", detail: `${photosWaiting} photo${photosWaiting === 1 ? "" : "s"} still to send.`, urgent: false };
  return { label: "Waiting to send", detail: "It goes when there is signal.", urgent: false };
}

/** The visits on this phone that the server does not have yet: read from the phone alone, so it works offline. */
export function VisitsOnPhone() {
  const userId = useFieldUserId();
  const data = useLive(async () => {
    const [visits, reference] = await Promise.all([visitsStillOnPhone(), phoneStore().reference.get(referenceKey())]);
    // Only the signed-in volunteer's visits: a shared phone may hold someone else's too.
    const own = visits.filter((item) => belongsTo(item.visit, userId));
    return { visits: own, transects: (reference?.value as FieldReference | undefined)?.transects ?? [] };
  }, [userId]);
  if (!data || data.visits.length === 0) return null;
  return (
    <section aria-labelledby="on-phone-heading" className="card border-tideline-600" data-testid="visits-on-phone">
      <h2 id="on-phone-heading" className="text-lg font-bold">On this phone, not sent yet</h2>
      <ul className="mt-2 space-y-2">
        {data.visits.map((item) => {
          const { visit } = item;
          const t = data.transects.find((x) => x.id === visit.transectId);
          const state = phoneStateOf(item);
          return (
            <li key={visit.id} className="rounded-lg border border-shingle-200 p-3" data-testid="visit-on-phone">
              <p className="font-bold">{visit.visitDate} · {t ? `${t.code} ${t.name}` : "Transect"}</p>
              <p className="text-sm">
                <span className={`rounded-full px-2 py-0.5 font-bold ${state.urgent ? "bg-rust-100 text-rust-700" : "bg-sand-100 text-sand-800"}`}>{state.label}</span>{" "}
                {item.sightings} sighting{item.sightings === 1 ? "" : "s"}, {item.photos} photo{item.photos === 1 ? "" : "s"}
              </p>
              {state.detail && <p className={`mt-1 text-sm ${state.urgent ? "text-rust-700" : "text-shingle-600"}`}>{state.detail}</p>}
              <a className="btn-quiet mt-2 min-w-tap w-full" href={`/field/visit?id=${visit.id}&transect=${visit.transectId}`}>Open this walk</a>
            </li>
          );
        })}
      </ul>
    </section>
  );
}
