import { AppShell } from "@/components/shell/app-shell";
import { requirePageActor } from "@/lib/auth/guard";
import { roles } from "@/lib/auth/roles";

/** A person's own account, whatever their roles. */
export default async function AccountLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(roles, "/account");
  return <AppShell actor={actor} nav={[{ href: "/account", label: "Your account" }]}>{children}</AppShell>;
}
