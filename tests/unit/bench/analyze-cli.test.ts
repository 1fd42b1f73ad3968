import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";

const root = join(import.meta.dirname, "../../..");
const fixtures = join(root, "tests/fixtures/captures");
const scratch = mkdtempSync(join(tmpdir(), "benchplate-cli-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** The CLI as `npm run --silent analyze` runs it (one bundle on plain Node), without npm's own start-up. */
function analyze(...args: string[]) {
  const run = spawnSync(process.execPath, [join(root, "scripts/run-bundled.mjs"), join(root, "scripts/analyze.ts"), ...args], { cwd: root, encoding: "utf8" });
  return { status: run.status, stdout: run.stdout, stderr: run.stderr };
}

describe("analyze CLI", { timeout: 30_000 }, () => {
  it("prints one JSON object with --json", () => {
    const run = analyze(
      join(fixtures, "orrery-orm42-hot-air.csv"),
      "--current", "CH1", "--current-scale", "10", "--voltage", "3",
      "--rated-power", "600", "--rated-voltage", "220-240", "--current-accuracy", "1.5%+0.05", "--rule", "guarded", "--json",
    );
    expect(run.status).toBe(0);
    expect(run.stderr).toBe("");
    const result = JSON.parse(run.stdout);
    expect(result).toMatchObject({ analysisVersion: expect.any(String), capture: { columns: { current: "CH1", voltage: "CH2" } } });
    expect(result.verdict).toMatchObject({ rated: 600, rule: "guarded", result: expect.any(String) });
  });

  it("prints a readable summary without --json", () => {
    const run = analyze(join(fixtures, "quillon-q3-soldering-station.tsv"), "--sample-interval", "0.0002");
    expect(run.status).toBe(0);
    expect(run.stdout).toMatch(/^Capture {3}quillon-q3-soldering-station\.tsv: 1250 samples/);
    expect(run.stdout).toMatch(/\nFiring {4}half-cycle: duty 33\.3 %/);
  });

  it("fails bad input with status 1, the message on stderr without a stack trace, and the error object with --json", () => {
    const ragged = join(scratch, "ragged.csv");
    writeFileSync(ragged, "# Kestrelline KL-2 scope\ntime,current\n0,1\n0.0002,2,3\n");
    const run = analyze(ragged, "--json");
    expect(run.status).toBe(1);
    expect(run.stderr).toBe("analyze: line 4: ragged rows: 3 values where the column names give 2\n");
    expect(JSON.parse(run.stdout)).toEqual({ error: { message: "ragged rows: 3 values where the column names give 2", line: 4 } });

    const plain = analyze(ragged);
    expect(plain.status).toBe(1);
    expect(plain.stdout).toBe("");
    expect(plain.stderr).not.toMatch(/\n\s+at /);
  });

  it("rejects bad flags with the usage", () => {
    const run = analyze(join(fixtures, "orrery-orm42-hot-air.csv"), "--lamp", "110", "--json");
    expect(run.status).toBe(1);
    expect(run.stderr).toMatch(/^analyze: --lamp must be 230 or 120\nusage: /);
    expect(JSON.parse(run.stdout)).toEqual({ error: { message: "--lamp must be 230 or 120", line: null } });
    expect(analyze(join(fixtures, "orrery-orm42-hot-air.csv"), "--rated-power", "600").stderr).toMatch(/--rated-power needs --rated-voltage/);
  });
});
