import { AppShell } from "@/components/shell/app-shell";
import { requirePageActor } from "@/lib/auth/guard";

export default async function ReviewLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["coordinator"], "/review");
  return <AppShell actor={actor} nav={[{ href: "/review", label: "Records to check" }]}>{children}</AppShell>;
}
