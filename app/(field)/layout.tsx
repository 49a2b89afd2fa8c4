import { FieldProviders } from "@/components/field/field-providers";
import { FieldShell } from "@/components/shell/field-shell";
import { requirePageActor } from "@/lib/auth/guard";

export default async function FieldLayout({ children }: { children: React.ReactNode }) {
  const actor = await requirePageActor(["volunteer"], "/field");
  return (
    <FieldShell
      actor={actor}
      area="/field"
      nav={[
        { href: "/field", label: "My transects" },
        { href: "/field/records", label: "My records" },
        { href: "/safety", label: "Safety" },
      ]}
    >
      <FieldProviders userId={actor.id}>{children}</FieldProviders>
    </FieldShell>
  );
}
