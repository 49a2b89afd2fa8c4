import { AppShell } from "@/components/shell/app-shell";
import { requirePageActor } from "@/lib/auth/guard";

export default async function PartnerLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["partner"], "/data");
  return <AppShell actor={actor} area="/data" nav={[{ href: "/data", label: "Network data" }]}>{children}</AppShell>;
}
