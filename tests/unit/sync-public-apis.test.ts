import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import ts from "typescript";
import { describe, expect, it } from "vitest";

// The sync path runs on drizzle and postgres.js through their public, documented entry points
// only, so a drizzle upgrade cannot break sync first. What drizzle keeps private: the `_`
// property of its database objects (marked @internal in its types) and its session classes
// (PgSession and the drivers' sessions and prepared queries), which only its drivers build.
const syncDir = path.resolve(process.cwd(), "lib/sync");
const privateDrizzleNames = /(Session|PreparedQuery|Transaction)$/;

function privateUses(name: string, text: string): string[] {
  const source = ts.createSourceFile(name, text, ts.ScriptTarget.Latest, true);
  const found: string[] = [];
  const visit = (node: ts.Node) => {
    if (ts.isPropertyAccessExpression(node) && node.name.text === "_") found.push(`${node.getText()} (drizzle's internal "_")`);
    if (ts.isImportDeclaration(node) && ts.isStringLiteral(node.moduleSpecifier) && node.moduleSpecifier.text.startsWith("drizzle-orm")) {
      const names = node.importClause?.namedBindings;
      if (names && ts.isNamedImports(names)) {
        for (const n of names.elements) if (privateDrizzleNames.test(n.name.text)) found.push(`import ${n.name.text} from "${node.moduleSpecifier.text}"`);
      }
    }
    ts.forEachChild(node, visit);
  };
  visit(source);
  return found.map((f) => `${name}: ${f}`);
}

describe("the sync path uses drizzle's and postgres.js's public APIs only", () => {
  it("finds a private use when there is one (the check can fail)", () => {
    const probe = 'import { PostgresJsSession } from "drizzle-orm/postgres-js";\nconst { client } = tx._.session;';
    expect(privateUses("probe.ts", probe)).toEqual([
      'probe.ts: import PostgresJsSession from "drizzle-orm/postgres-js"',
      'probe.ts: tx._ (drizzle\'s internal "_")',
    ]);
  });

  it("no file in lib/sync reaches into drizzle's sessions or its internal `_`", () => {
    const files = readdirSync(syncDir).filter((f) => f.endsWith(".ts"));
    expect(files.length).toBeGreaterThan(5);
    expect(files.flatMap((f) => privateUses(f, readFileSync(path.join(syncDir, f), "utf8")))).toEqual([]);
  });
});
