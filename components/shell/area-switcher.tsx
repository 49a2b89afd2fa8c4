import type { Actor } from "@/lib/auth/guard";
import { areasFor } from "@/lib/auth/roles";
import type { ShellLink } from "./shell-frame";

/**
 * For a person with more than one area (an organiser who also walks a transect, a reviewer who
 * records): a link to each of their areas, the current one marked. Nothing for one area.
 */
export function AreaSwitcher({ actor, current, link: NavLink }: { actor: Actor; current?: string; link: ShellLink }) {
  const mine = areasFor(actor.roles);
  if (mine.length < 2) return null;
  return (
    <nav aria-label="Your areas" className="mx-auto max-w-5xl px-2">
      <ul className="flex flex-wrap gap-1 text-sm">
        {mine.map((area) => (
          <li key={area.home}>
            {area.home === current ? (
              <span aria-current="page" className="inline-flex min-h-tap items-center rounded-lg bg-tideline-50 px-3 font-bold text-tideline-800">
                {area.label}
              </span>
            ) : (
              <NavLink href={area.home} className="inline-flex min-h-tap items-center rounded-lg px-3 font-bold text-tideline-700 hover:bg-tideline-50">
                {area.label}
              </NavLink>
            )}
          </li>
        ))}
      </ul>
    </nav>
  );
}
