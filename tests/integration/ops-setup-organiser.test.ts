import { spawnSync } from "node:child_process";
import { eq, sql } from "drizzle-orm";
import { beforeAll, describe, expect, it } from "vitest";
import { db } from "@/db/client";
import { invitations, users } from "@/db/schema";
import { SETUP_ACCOUNT } from "@/lib/queries/first-organiser";
import { acceptInvitation, findOpenInvitation } from "@/lib/queries/people";
import { repoRoot } from "../support/ops-shell";
import "./support/db";

// A real network starts with no accounts: `npm run setup:organiser` prints a one-time link to the
// existing /invitation/<token> page, where the first organiser chooses a password.
const APP_URL = "https://records.example.org";
const clientAddress = "203.0.113.7"; // TEST-NET-3, RFC 5737

function setupOrganiser(...args: string[]) {
  return spawnSync("npm", ["run", "--silent", "setup:organiser", "--", ...args], {
    cwd: repoRoot,
    env: { ...process.env, APP_URL },
    encoding: "utf8",
    timeout: 30_000,
  });
}

const linkIn = (stdout: string) => stdout.match(/^https:\/\/records\.example\.org\/invitation\/([A-Za-z0-9_-]{43})$/m)?.[1];

describe("npm run setup:organiser", () => {
  beforeAll(async () => {
    const tables = await db().execute<{ tablename: string }>(sql`select tablename from pg_tables where schemaname = 'public'`);
    await db().execute(sql.raw(`truncate ${tables.map((t) => `"${t.tablename}"`).join(", ")} restart identity cascade`));
  });

  it("prints a link that opens an organiser's invitation, usable once", async () => {
    const run = setupOrganiser("--email", "Ada@Example.org", "--name", "Ada Lovelace");
    expect(run.stderr).toBe("");
    expect(run.status).toBe(0);
    const token = linkIn(run.stdout);
    expect(token).toBeDefined();

    const invite = await findOpenInvitation(token!, clientAddress);
    expect(invite).toMatchObject({ email: "ada@example.org", name: "Ada Lovelace", roles: ["organiser"] });
    expect(invite!.expiresAt.getTime() - Date.now()).toBeGreaterThan(23 * 3_600_000);

    const user = await acceptInvitation(token!, "a long enough password", clientAddress);
    const [account] = await db().select().from(users).where(eq(users.id, user.id));
    expect(account).toMatchObject({ roles: ["organiser"], active: true, email: "ada@example.org" });
    expect(account!.passwordHash).toMatch(/^\$2[aby]\$/);

    await expect(acceptInvitation(token!, "another long password", clientAddress)).rejects.toMatchObject({ status: 404 });
    expect(await findOpenInvitation(token!, clientAddress)).toBeNull();
  }, 120_000);

  it("nobody can sign in as the account that stands for the command", async () => {
    const [setup] = await db().select().from(users).where(eq(users.email, SETUP_ACCOUNT.email));
    expect(setup).toMatchObject({ active: false, passwordHash: null });
  });

  it("refuses once the network has an organiser, unless --force", async () => {
    const refused = setupOrganiser("--email", "grace@example.org");
    expect(refused.status).toBe(1);
    expect(refused.stderr).toMatch(/already has an organiser \(ada@example\.org\)/);
    expect(linkIn(refused.stdout)).toBeUndefined();
    expect(await db().select().from(invitations).where(eq(invitations.email, "grace@example.org"))).toHaveLength(0);

    const forced = setupOrganiser("--email", "grace@example.org", "--force");
    expect(forced.status).toBe(0);
    const invite = await findOpenInvitation(linkIn(forced.stdout)!, clientAddress);
    expect(invite).toMatchObject({ email: "grace@example.org", name: "Network organiser", roles: ["organiser"] });
  }, 120_000);

  it("refuses someone already in the network, even with --force", () => {
    const run = setupOrganiser("--email", "ada@example.org", "--force");
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/already in the network/);
  }, 120_000);

  it("refuses bad flags with exit status 2 and the usage line", () => {
    for (const args of [["--name", "No Address"], ["--email", "a@b.example", "--role", "partner"]]) {
      const run = setupOrganiser(...args);
      expect(run.status).toBe(2);
      expect(run.stderr).toMatch(/usage: npm run setup:organiser -- --email/);
    }
  }, 120_000);
});
