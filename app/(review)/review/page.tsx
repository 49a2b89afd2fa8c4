import type { Metadata } from "next";
import { Suspense } from "react";
import { ReviewProviders } from "@/components/review/queue/review-providers";
import { ReviewQueue } from "@/components/review/queue/review-queue";
import { requirePageActor } from "@/lib/auth/guard";
import { REVIEWERS } from "@/lib/auth/roles";
import { env } from "@/lib/env";

export const metadata: Metadata = { title: "Sightings to review" };

/** The reviewers' queue. Everything below the heading is the client part, fed by /api/review/*. */
export default async function ReviewHome() {
  await requirePageActor(REVIEWERS, "/review");
  return (
    <div className="space-y-4">
      <div>
        <h1 className="text-2xl font-bold text-tideline-800">Sightings to review</h1>
        <p className="text-shingle-700">Only confirmed sightings count in a season&apos;s results. Confirm what is plain, ask the volunteer when something needs saying, and set aside what cannot stand.</p>
      </div>
      <ReviewProviders tileCredit={env().MAP_TILE_ATTRIBUTION ?? null}>
        {/* The queue reads its filters from the address (useSearchParams). */}
        <Suspense fallback={<p className="card">Loading the sightings…</p>}>
          <ReviewQueue tileUrl={env().MAP_TILE_URL ?? null} />
        </Suspense>
      </ReviewProviders>
    </div>
  );
}
