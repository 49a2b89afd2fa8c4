// What the organiser's home (app/(network)/network/page.tsx) asks the query layer for, in one
// place, so bench:network times the same call as the page.
import type { Actor } from "../../lib/auth/guard";
import { networkHome } from "../../lib/queries/effort";

export const homePageData = (actor: Actor) => networkHome(actor);
