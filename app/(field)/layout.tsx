import { FieldProviders } from "@/components/field/field-providers";
import { FieldShell } from "@/components/shell/field-shell";
import { redirect } from "next/navigation";
import { requirePageActor } from "@/lib/auth/guard";
import { needsAgreement } from "@/lib/queries/agreements";

export default async function FieldLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["volunteer"], "/field");
  // Until they accept the current recorder agreement (offline, the cached pages still open).
  if (await needsAgreement(actor)) redirect("/agreement");
  return (
    <FieldShell
      actor={actor}
      area="/field"
      nav={[
        { href: "/field", label: "My transects" },
        { href: "/field/records", label: "My walks" },
        { href: "/safety", label: "Safety" },
      ]}
    >
      <FieldProviders userId={actor.id}>{children}</FieldProviders>
    </FieldShell>
  );
}
