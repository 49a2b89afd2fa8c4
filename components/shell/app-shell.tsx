import Link from "next/link";
import type { Actor } from "@/lib/auth/guard";
import { ShellFrame, type NavItem } from "./shell-frame";

export type { NavItem } from "./shell-frame";

/** The signed-in frame with client-side navigation between pages. */
export function AppShell({ actor, area, nav, children }: { actor: Actor; area?: string; nav: NavItem[]; children: React.ReactNode }) {
  return <ShellFrame actor={actor} area={area} nav={nav} link={Link}>{children}</ShellFrame>;
}
