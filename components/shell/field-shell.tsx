import type { Actor } from "@/lib/auth/guard";
import { ShellFrame, type NavItem } from "./shell-frame";

function DocumentLink({ href, className, children }: { href: string; className?: string; children: React.ReactNode }) {
  return <a href={href} className={className}>{children}</a>;
}

/** The volunteer's frame: every link is a plain document load, so it works offline through the service worker. */
export function FieldShell({ actor, area, nav, children }: { actor: Actor; area?: string; nav: NavItem[]; children: React.ReactNode }) {
  return <ShellFrame actor={actor} area={area} nav={nav} link={DocumentLink}>{children}</ShellFrame>;
}
