import { NetworkProviders } from "@/components/network/network-providers";
import { AppShell } from "@/components/shell/app-shell";
import { requirePageActor } from "@/lib/auth/guard";
import { env } from "@/lib/env";

export default async function NetworkLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["organiser"], "/network");
  return (
    <AppShell
      actor={actor}
      area="/network"
      nav={[{ href: "/network", label: "Overview" }, { href: "/network/seasons", label: "Seasons" }, { href: "/network/transects", label: "Transects" }, { href: "/network/habitats", label: "Habitat groups" }, { href: "/network/checklist", label: "Checklist" }, { href: "/network/people", label: "People" }, { href: "/network/earlier-seasons", label: "Earlier seasons" }, { href: "/network/review-rules", label: "Walk rules and warnings" }, { href: "/network/agreement", label: "Recorder agreement" }, { href: "/network/history", label: "History" }]}
    >
      <NetworkProviders tileCredit={env().MAP_TILE_ATTRIBUTION ?? null}>{children}</NetworkProviders>
    </AppShell>
  );
}
