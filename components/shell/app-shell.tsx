import Link from "next/link";
import type { Actor } from "@/lib/auth/guard";
import { ShellFrame, type NavItem } from "./shell-frame";

export type { NavItem } from "./shell-frame";

/** The signed-in frame with client-side navigation between pages. */
export function AppShell({ actor, nav, children }: { actor: Actor; nav: NavItem[]; children: React.ReactNode }) {
  return <ShellFrame actor={actor} nav={nav} link={Link}>{children}</ShellFrame>;
}
