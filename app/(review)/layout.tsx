import { AppShell } from "@/components/shell/app-shell";
import { requirePageActor } from "@/lib/auth/guard";
import { REVIEWERS } from "@/lib/auth/roles";

export default async function ReviewLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(REVIEWERS, "/review");
  return <AppShell actor={actor} area="/review" nav={[{ href: "/review", label: "Sightings to review" }, { href: "/review/paper-walks/new", label: "Enter a paper walk" }]}>{children}</AppShell>;
}
