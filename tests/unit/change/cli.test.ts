import { spawn } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { compareSeasonsSync } from "../../../lib/change/compare";
import { parseSpeciesTableCsv } from "../../../lib/change/csv";

const root = path.resolve(import.meta.dirname, "../../..");
const dir = mkdtempSync(path.join(tmpdir(), "turnstone-cli-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function file(name: string, text: string): string {
  const p = path.join(dir, name);
  writeFileSync(p, text);
  return p;
}

function run(command: string, args: string[]): Promise<{ code: number | null; stdout: string; stderr: string }> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, { cwd: root, stdio: ["ignore", "pipe", "pipe"] });
    let stdout = "";
    let stderr = "";
    child.stdout.on("data", (d: Buffer) => (stdout += d.toString()));
    child.stderr.on("data", (d: Buffer) => (stderr += d.toString()));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, stdout, stderr }));
  });
}
const compare = (...args: string[]) => run("npx", ["tsx", "scripts/compare.ts", ...args]);
// The error matrix runs the same script with tsx's loader on node directly: npx and tsx's
// launcher add a second of start-up per run, which a dozen runs would turn into the
// slowest part of the suite.
const compareFast = (...args: string[]) => run(process.execPath, ["--import", "tsx", "scripts/compare.ts", ...args]);

const T1 = "site,Erithacus rubecula,Turdus merula,\"Parus major\"\nT01,3,2,0\nT02,1,0,4\nT03,0,0,0\nT04,2,2,2\nT05,0,5,1\nT08,1,1,1\n";
const T2 = "site,Turdus merula,Erithacus rubecula,Sitta europaea\r\nT01,1,3,4\r\nT02,0,0,1\r\nT03,0,0,0\r\nT04,2,2,2\r\nT05,3,0,0\r\nT09,1,0,0\r\n";
const before = file("t1.csv", T1);
const after = file("t2.csv", T2);

describe("scripts/compare.ts", { timeout: 60_000 }, () => {
  it("prints one JSON document of the documented shape, equal to the library's result", async () => {
    const { code, stdout, stderr } = await compare("--before", before, "--after", after, "--permutations", "199", "--seed", "7", "--index", "ruzicka");
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(Object.keys(json)).toEqual(["index", "mode", "permutations", "seed", "adjust", "alpha", "minimumP", "sites", "excluded", "summary", "pairedTest"]);
    expect(json).toMatchObject({ index: "ruzicka", mode: "paired", permutations: 199, seed: 7, adjust: "holm", alpha: 0.05, minimumP: 1 / 200 });
    expect(Object.keys(json.sites[0])).toEqual(["site", "shared", "lost", "gained", "losses", "gains", "dissimilarity", "direction", "p", "pAdjusted", "exceptional"]);
    expect(json.sites.map((s: { site: string }) => s.site)).toEqual(["T01", "T02", "T04", "T05"]);
    expect(json.excluded).toEqual([
      { site: "T03", reason: "no species recorded in either season" },
      { site: "T08", reason: "only in the baseline survey (T1)" },
      { site: "T09", reason: "only in the comparison survey (T2)" },
    ]);
    expect(Object.keys(json.summary)).toEqual(["meanLosses", "meanGains", "meanDissimilarity", "lossShare", "gainShare", "direction"]);
    expect(Object.keys(json.pairedTest)).toEqual(["n", "meanDifference", "t", "df", "p", "pPermutation"]);
    const expected = compareSeasonsSync(parseSpeciesTableCsv(T1, "a"), parseSpeciesTableCsv(T2, "b"), { index: "ruzicka", permutations: 199, seed: 7 });
    expect(json).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  it("gives null p-values with --permutations 0", async () => {
    const { code, stdout } = await compareFast("--before", before, "--after", after, "--permutations", "0");
    expect(code).toBe(0);
    const json = JSON.parse(stdout);
    expect(json.minimumP).toBeNull();
    expect(json.pairedTest.pPermutation).toBeNull();
    for (const s of json.sites) expect(s).toMatchObject({ p: null, pAdjusted: null, exceptional: false });
  });

  it("npm run --silent compare leaves only the JSON document on stdout", async () => {
    const { code, stdout } = await run("npm", ["run", "--silent", "compare", "--", "--before", before, "--after", after, "--permutations", "99"]);
    expect(code).toBe(0);
    expect(() => JSON.parse(stdout)).not.toThrow();
    expect(stdout.trimStart().startsWith("{")).toBe(true);
  });

  it("gives the same result on worker threads as in-process (workers run under tsx)", async () => {
    const { code, stdout, stderr } = await compare("--before", before, "--after", after, "--permutations", "600", "--mode", "independent", "--threads", "2");
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const expected = compareSeasonsSync(parseSpeciesTableCsv(T1, "a"), parseSpeciesTableCsv(T2, "b"), { permutations: 600, mode: "independent" });
    expect(JSON.parse(stdout)).toEqual(JSON.parse(JSON.stringify(expected)));
  });

  it("prints the per-site table with --format csv", async () => {
    const { code, stdout, stderr } = await compareFast("--before", before, "--after", after, "--format", "csv", "--permutations", "9");
    expect(code).toBe(0);
    const lines = stdout.trim().split("\n");
    expect(lines[0]).toBe("site,shared,lost,gained,losses,gains,dissimilarity,direction,p,pAdjusted,exceptional");
    expect(lines.slice(1).map((l) => l.split(",")[0])).toEqual(["T01", "T02", "T04", "T05"]);
    expect(stderr).toMatch(/T03.*no species recorded/);
  });

  const bad: Array<[string, string, RegExp]> = [
    ["bad cell", "site,a,b\nT01,1,x\n", /line 2, column 3: "x" is not a number/],
    ["negative number", "site,a,b\nT01,1,2\nT02,-3,0\n", /line 3, column 2: negative number -3/],
    ["duplicate site", "site,a\nT01,1\nT02,1\nT01,2\n", /line 4, column 1: duplicate site "T01"/],
    ["duplicate species", "site,a,b,a\nT01,1,2,3\n", /line 1, column 4: duplicate species "a"/],
    ["ragged row", "site,a,b\nT01,1,2\nT02,1\n", /line 3, column 3: row has 2 fields but the header has 3/],
    ["empty file", "", /the file is empty/],
  ];
  it("exits 2 with file, line and column on stderr and nothing on stdout for malformed files", async () => {
    const files = bad.map(([name, text]) => file(`${name.replace(/ /g, "-")}.csv`, text));
    const results = await Promise.all(files.map((broken) => compareFast("--before", before, "--after", broken)));
    results.forEach(({ code, stdout, stderr }, k) => {
      expect(code).toBe(2);
      expect(stdout).toBe("");
      expect(stderr).toContain(files[k]!);
      expect(stderr).toMatch(bad[k]![2]);
    });
  });

  it("exits 2 for unreadable files and bad arguments, with nothing on stdout", async () => {
    const folder = path.join(dir, "a-folder.csv");
    mkdirSync(folder, { recursive: true });
    const results = await Promise.all([
      compareFast("--before", path.join(dir, "missing.csv"), "--after", after),
      compareFast("--before", folder, "--after", after),
      compareFast("--before", before, "--index", "bray", "--alpha", "1", "--permutations=-5"),
      compareFast("--before", before, "--after", after, "--bogus", "1"),
    ]);
    for (const r of results) {
      expect(r.code).toBe(2);
      expect(r.stdout).toBe("");
    }
    expect(results[0]!.stderr).toMatch(/missing\.csv: cannot read the file \(ENOENT\)/);
    expect(results[1]!.stderr).toMatch(/a-folder\.csv: cannot read the file \(EISDIR\)/);
    expect(results[2]!.stderr).toMatch(/--after T2.csv is required/);
    expect(results[2]!.stderr).toMatch(/--index must be one of/);
    expect(results[2]!.stderr).toMatch(/--alpha must be below 1/); // alpha lies in (0, 1): lib/limits/analysis.ts
    expect(results[2]!.stderr).toMatch(/--permutations must be a whole number/);
    expect(results[3]!.stderr).toMatch(/Unknown option '--bogus'/);
  });
});
