import "server-only";
import { eq, sql } from "drizzle-orm";
import { db, type Transaction } from "@/db/client";
import { networkSettings } from "@/db/schema";
import type { Actor } from "@/lib/auth/guard";
import { notFound } from "@/lib/errors";
import { DEFAULT_WALK_RULES, type WalkRules } from "@/lib/review/walk-rules";
import { DEFAULT_WARNING_RULES, type WarningRules } from "@/lib/review/warning-rules";
import { logChange } from "./change-log";

// The network's walk rules and warning thresholds (network_settings.walk_rules, .warning_rules),
// edited by organisers on /network/review-rules. The triggers of drizzle/0008 judge each walk and
// sighting as it is written; a change of the rules judges every stored one again, here.

export type ReviewRules = { walkRules: WalkRules; warningRules: WarningRules };
export type ReviewRulesSaved = ReviewRules & { walksRejudged: number; sightingsRejudged: number };

/** The network's rules, or the defaults before the settings row exists (as network_walk_rules() in SQL). */
export async function reviewRules(): Promise<ReviewRules> {
  const [row] = await db().select({ walkRules: networkSettings.walkRules, warningRules: networkSettings.warningRules }).from(networkSettings).where(eq(networkSettings.id, 1));
  return { walkRules: row?.walkRules ?? DEFAULT_WALK_RULES, warningRules: row?.warningRules ?? DEFAULT_WARNING_RULES };
}

const walkWords: Record<keyof WalkRules, string> = {
  windowStart: "walks start from",
  windowEnd: "walks end by",
  coolMinimumC: "lowest temperature °C",
  coolSunshinePercent: "sunshine needed below the warm threshold %",
  warmEnoughC: "warm enough for any sun °C",
  maxWindBeaufort: "strongest wind (Beaufort)",
  rainAllowed: "rain allowed",
};
const warningWords: Record<keyof WarningRules, string> = {
  countFactor: "far above earlier counts: times the highest",
  countMinimum: "far above earlier counts: at least",
  firstRecordMinSeasons: "first on a transect: earlier seasons needed",
};

function changes<T extends object>(before: T, after: T, words: Record<keyof T, string>): string[] {
  return (Object.keys(words) as (keyof T)[])
    .filter((k) => before[k] !== after[k])
    .map((k) => `${words[k]} ${String(before[k])} → ${String(after[k])}`);
}

const same = <T extends object>(a: T, b: T) => (Object.keys(a) as (keyof T)[]).every((k) => a[k] === b[k]) && Object.keys(a).length === Object.keys(b).length;

/**
 * Every stored walk judged by the network's walk rules again, writing only those whose breaches
 * change. network_walk_rules() reads the settings row this transaction has just written.
 */
async function rejudgeWalks(tx: Transaction): Promise<number> {
  const rows = await tx.execute(sql`
    with r as (select network_walk_rules() as rules)
    update visits v
    set rule_breaches = walk_rule_breaches(v.start_time, v.end_time, v.temperature_c, v.sunshine_percent, v.wind_beaufort, v.rain, r.rules)
    from r
    where v.rule_breaches is distinct from walk_rule_breaches(v.start_time, v.end_time, v.temperature_c, v.sunshine_percent, v.wind_beaufort, v.rain, r.rules)
    returning v.id`);
  return rows.length;
}

/** Every stored sighting's warnings again (each computed once), writing only those that change. */
async function rejudgeSightings(tx: Transaction): Promise<number> {
  const rows = await tx.execute(sql`
    update sightings s set warnings = w.kinds
    from (select x.id, sighting_warning_kinds(x.id, x.visit_id, x.species_id, x.count) as kinds from sightings x) w
    where s.id = w.id and s.warnings is distinct from w.kinds
    returning s.id`);
  return rows.length;
}

/**
 * Saves the rules in one transaction: the settings row locked, the rules written, the change
 * logged, and every walk and sighting judged again by whichever rules changed. While it runs,
 * visits (or sightings) take no other writes (SHARE lock, waiting for writers already under way):
 * a walk synced meanwhile would otherwise be judged by the old rules and missed by the rejudging.
 */
export async function setReviewRules(actor: Actor, input: ReviewRules): Promise<ReviewRulesSaved> {
  return db().transaction(async (tx) => {
    const [before] = await tx
      .select({ walkRules: networkSettings.walkRules, warningRules: networkSettings.warningRules })
      .from(networkSettings)
      .where(eq(networkSettings.id, 1))
      .for("update");
    if (!before) throw notFound("The network's settings");
    const walkChanged = !same(before.walkRules, input.walkRules);
    const warningChanged = !same(before.warningRules, input.warningRules);
    if (!walkChanged && !warningChanged) return { ...input, walksRejudged: 0, sightingsRejudged: 0 };

    await tx.update(networkSettings).set({ walkRules: input.walkRules, warningRules: input.warningRules, updatedAt: new Date() }).where(eq(networkSettings.id, 1));
    // visits before sightings: the order every writer takes them in (a walk, then its sightings).
    if (walkChanged) await tx.execute(sql`lock table visits in share mode`);
    if (warningChanged) await tx.execute(sql`lock table sightings in share mode`);
    const walksRejudged = walkChanged ? await rejudgeWalks(tx) : 0;
    const sightingsRejudged = warningChanged ? await rejudgeSightings(tx) : 0;
    const said = [...changes(before.walkRules, input.walkRules, walkWords), ...changes(before.warningRules, input.warningRules, warningWords)];
    await logChange(tx, actor, {
      entity: "settings",
      entityId: "review_rules",
      action: "update",
      summary: `Walk rules and warnings: ${said.join("; ")} (${walksRejudged} walks and ${sightingsRejudged} sightings marked differently)`,
      before,
      after: { walkRules: input.walkRules, warningRules: input.warningRules },
    });
    return { ...input, walksRejudged, sightingsRejudged };
  });
}
