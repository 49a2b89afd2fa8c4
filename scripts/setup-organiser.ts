// npm run setup:organiser -- --email ada@your-network.example [--name "Ada Lovelace"] [--force]
// Prints a one-time link with which the network's first organiser chooses a password; the account
// is created when they do. Refused once an organiser exists, unless --force.
import "./server-conditions";
import "./load-env";
import { z } from "zod";
import { inviteSchema } from "@/app/(network)/network/people/schema";
import { isAppError } from "@/lib/errors";
import { parseFlags } from "./cli-flags";
import { requireEnv } from "./require-env";

const usage = 'npm run setup:organiser -- --email you@your-network.example [--name "Your Name"] [--force]';
const flags = parseFlags(
  usage,
  { email: { type: "string" }, name: { type: "string" }, force: { type: "boolean" } },
  // The same limits as an invitation sent from the People page.
  z.object({
    email: inviteSchema.shape.email,
    name: inviteSchema.shape.name.default("Network organiser"),
    force: z.boolean().default(false),
  }),
);
requireEnv();

const { closeDb } = await import("@/db/client");
const { FIRST_ORGANISER_LINK_HOURS, inviteFirstOrganiser } = await import("@/lib/queries/first-organiser");
try {
  const { link } = await inviteFirstOrganiser(flags);
  console.log(`[turnstone] One-time link for ${flags.name} <${flags.email}> to choose a password and become an organiser (works once, for ${FIRST_ORGANISER_LINK_HOURS} hours):`);
  console.log(link);
  console.log("[turnstone] Anyone who has the link can use it: open it yourself, or pass it on privately.");
} catch (error) {
  console.error(`[turnstone] ${isAppError(error) ? error.message : `setting up the organiser failed: ${error instanceof Error ? error.message : error}`}`);
  process.exitCode = 1;
} finally {
  await closeDb();
}
