import type { ComponentType, ReactNode } from "react";
import { LogoMark } from "@/components/brand/logo-mark";
import type { Actor } from "@/lib/auth/guard";
import { hasRole, roleLabel } from "@/lib/auth/roles";
import { AreaSwitcher } from "./area-switcher";
import { SignOutButton } from "./sign-out-button";

export type NavItem = { href: string; label: string };
export type ShellLink = ComponentType<{ href: string; className?: string; children: ReactNode }>;

/**
 * The frame every signed-in page sits in: brand, the area's own menu, who is signed in with their
 * roles, and for a person with several areas a way between them (`area` is this one's home). The link
 * component is the caller's: next/link for client-side navigation (app-shell.tsx), or plain
 * anchors for the field pages (field-shell.tsx), whose links must stay document loads that the
 * service worker can answer offline, and whose bundle does without the router's link code.
 */
export function ShellFrame({ actor, area, nav, link: NavLink, children }: { actor: Actor; area?: string; nav: NavItem[]; link: ShellLink; children: ReactNode }) {
  return (
    <div className="flex min-h-dvh flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:inline-flex focus:min-h-tap focus:min-w-tap focus:items-center focus:rounded focus:bg-white focus:p-2">
        Skip to content
      </a>
      <header className="border-b border-shingle-200 bg-white">
        <div className="mx-auto flex max-w-5xl items-center gap-3 px-4 py-2">
          <NavLink href="/" className="flex min-h-tap items-center gap-2 font-bold text-tideline-800 no-underline">
            <LogoMark size={32} />
            <span className="text-lg">Turnstone</span>
          </NavLink>
          <span className="ml-auto hidden text-right text-sm text-shingle-600 sm:block">
            <NavLink href="/account" className="text-tideline-700">{actor.name}</NavLink>
            <br />
            <span className="font-bold text-shingle-800">{actor.roles.map((r) => roleLabel[r]).join(" · ")}</span>
          </span>
          <SignOutButton phoneUserId={hasRole(actor, "volunteer") ? actor.id : undefined} />
        </div>
        <AreaSwitcher actor={actor} current={area} link={NavLink} />
        <nav aria-label="Main" className="mx-auto max-w-5xl overflow-x-auto px-2">
          <ul className="flex gap-1">
            {nav.map((item) => (
              <li key={item.href}>
                <NavLink href={item.href} className="inline-flex min-h-tap items-center rounded-t-lg px-3 font-bold text-tideline-700 hover:bg-tideline-50">
                  {item.label}
                </NavLink>
              </li>
            ))}
          </ul>
        </nav>
      </header>
      <main id="main" className="mx-auto w-full max-w-5xl flex-1 px-4 py-6">
        {children}
      </main>
      <footer className="border-t border-shingle-200 px-4 py-3 text-center text-sm text-shingle-600">
        <NavLink href="/safety" className="inline-flex min-h-tap min-w-tap items-center font-bold text-tideline-700">Fieldwork safety</NavLink>
        {" · "}
        <NavLink href="/account" className="inline-flex min-h-tap min-w-tap items-center font-bold text-tideline-700">Your account and data</NavLink>
      </footer>
    </div>
  );
}
