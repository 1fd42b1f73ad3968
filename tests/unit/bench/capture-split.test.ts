// A large capture read in two ranges at once (this thread and a helper) must give exactly what one pass gives:
// the same samples, sample rate and header, and the same first rejection with the same line.

import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { analyzeCapture } from "@/lib/bench/analysis";
import {
  CaptureError,
  readCaptureFile,
  readClaimedBlocks,
  type Capture,
  type CaptureBlockPlan,
  type CaptureBlocksReader,
  type CaptureBlockTally,
} from "@/lib/bench/capture-csv";
import { startHelperThread, type HelperThread } from "@/lib/bench/helper-thread";

const RATE = 20_000;
/** About 10 MB: above the size from which a file is split. */
const ROWS = 420_000;

let directory: string;
let helper: HelperThread;

beforeAll(async () => {
  directory = mkdtempSync(join(tmpdir(), "benchplate-split-"));
  helper = startHelperThread();
  // A first read waits for the thread to start: this thread reads a block in milliseconds, so a helper still
  // starting would find every block taken.
  await readCaptureFile(write("warm-up.csv", captureText()), {}, helper.readBlocks);
});

afterAll(async () => {
  await helper.close();
  rmSync(directory, { recursive: true, force: true });
});

/** Data rows (time, current, voltage) of a 50 Hz heater burst-fired 3 cycles in 5; made once, edited per test. */
const dataRows = Array.from({ length: ROWS }, (_, k) => {
  const cycles = (50 * k) / RATE;
  const volts = 325 * Math.sin(2 * Math.PI * cycles);
  const amps = Math.floor(cycles) % 5 < 3 ? volts / 52.9 : 0;
  return [(k / RATE).toFixed(5), amps.toFixed(4), volts.toFixed(2)];
});

/** The capture's text; `edit` may replace any data row's text (0-based row). */
function captureText({ delimiter = ",", decimal = ".", newline = "\n", edit }: { delimiter?: string; decimal?: string; newline?: string; edit?: (row: number, text: string) => string } = {}): string {
  const header = ["# Pellucid Instruments PX-2 logger export", `Sample rate${delimiter}${RATE}`, ["time", "current", "voltage"].join(delimiter)];
  const rows = dataRows.map((fields, k) => {
    const text = fields.map((field) => (decimal === "." ? field : field.replace(".", decimal))).join(delimiter);
    return edit ? edit(k, text) : text;
  });
  return [...header, ...rows].join(newline);
}

function write(name: string, text: string): string {
  const path = join(directory, name);
  writeFileSync(path, text);
  return path;
}

/** The helper's side read on this thread, taking turns with the front at each chunk. */
const backOnThisThread: CaptureBlocksReader = (plan) => readClaimedBlocks(plan, "back");

/** Keeps the plan given to the helper and the blocks it read, so a test knows the file really was split, and where. */
function counting(reader: CaptureBlocksReader): { reader: CaptureBlocksReader; plans: CaptureBlockPlan[]; tallies: CaptureBlockTally[] } {
  const plans: CaptureBlockPlan[] = [];
  const tallies: CaptureBlockTally[] = [];
  return {
    plans,
    tallies,
    reader: async (plan) => {
      plans.push(plan);
      const read = await reader(plan);
      tallies.push(...read);
      return read;
    },
  };
}

/** Data rows (0-based) before this byte of the capture's text: the header takes three lines. */
function rowsBefore(text: string, byte: number): number {
  return text.slice(0, byte).split("\n").length - 1 - 3;
}

async function rejectionOf(read: Promise<Capture>): Promise<CaptureError> {
  try {
    await read;
  } catch (error) {
    expect(error).toBeInstanceOf(CaptureError);
    return error as CaptureError;
  }
  throw new Error("the capture was accepted");
}

function expectSameCapture(split: Capture, whole: Capture): void {
  expect(split.sampleCount).toBe(whole.sampleCount);
  expect(split.sampleRateHz).toBe(whole.sampleRateHz);
  expect(split.header).toEqual(whole.header);
  expect(split.mapping).toEqual(whole.mapping);
  expect(split.firstDataLine).toBe(whole.firstDataLine);
  // Element by element: a moved or missing row anywhere shows up as a difference.
  expect(Buffer.from(split.current!.buffer, split.current!.byteOffset, whole.sampleCount * 8).equals(Buffer.from(whole.current!.buffer, whole.current!.byteOffset, whole.sampleCount * 8))).toBe(true);
  expect(Buffer.from(split.voltage!.buffer, split.voltage!.byteOffset, whole.sampleCount * 8).equals(Buffer.from(whole.voltage!.buffer, whole.voltage!.byteOffset, whole.sampleCount * 8))).toBe(true);
}

describe("reading a large capture in blocks on two threads", { timeout: 60_000 }, () => {
  it("gives the samples of one pass, with the helper thread reading blocks from the back", async () => {
    const path = write("plain.csv", captureText());
    const { reader, plans, tallies } = counting(helper.readBlocks);
    const split = await readCaptureFile(path, {}, reader);
    const blocks = plans[0]!.starts.length - 1;
    expect(blocks).toBeGreaterThan(1);
    expect(tallies.length).toBeGreaterThan(0);
    expect(tallies.map((tally) => tally.block)).toEqual(Array.from({ length: tallies.length }, (_, k) => blocks - 1 - k));
    expect(tallies.every((tally) => tally.rows > 0 && !tally.full && tally.error === null)).toBe(true);
    expect(split.current!.buffer).toBeInstanceOf(SharedArrayBuffer);
    expectSameCapture(split, await readCaptureFile(path, {}));
  });

  it("closes the gaps left by comment and blank lines and by rows set aside but not used, and reads a last line without a line feed", async () => {
    const text = captureText({ edit: (row, line) => (row > 100_000 && row % 1000 === 0 ? `# marker ${row}\n\n${line}` : line) });
    const path = write("comments.csv", text.trimEnd());
    const split = await readCaptureFile(path, {}, backOnThisThread);
    expect(split.sampleCount).toBe(ROWS);
    expectSameCapture(split, await readCaptureFile(path, {}));
  });

  it("reads semicolons with decimal commas and CRLF line ends the same way", async () => {
    const path = write("semicolon.csv", `${captureText({ delimiter: ";", decimal: ",", newline: "\r\n" })}\r\n`);
    const whole = await readCaptureFile(path, {});
    expect(whole.delimiter).toBe(";");
    expectSameCapture(await readCaptureFile(path, {}, helper.readBlocks), whole);
  });

  it("reports the first rejection in file order with its line, whichever thread read it", async () => {
    const cases: [string, (row: number, text: string) => string][] = [
      ["text in the last block", (row, text) => (row === 350_000 ? text.replace(/,[^,]*$/, ",n/a") : text)],
      ["a ragged row in an early block and text in the last", (row, text) => (row === 150_000 ? `${text},1` : row === 350_000 ? `${text}x` : text)],
      ["time going back in the last block", (row, text) => (row === 400_000 ? text.replace(/^[^,]*/, "0.1") : text)],
    ];
    for (const [name, edit] of cases) {
      const path = write("bad.csv", captureText({ edit }));
      const whole = await rejectionOf(readCaptureFile(path, {}));
      const split = await rejectionOf(readCaptureFile(path, {}, helper.readBlocks));
      expect(split.message, name).toBe(whole.message);
      expect(split.line, name).toBe(whole.line);
    }
  });

  it("checks time across a join: a repeated time at a block's first row, and a gap there", async () => {
    const plain = captureText();
    const { reader, plans } = counting(backOnThisThread);
    await readCaptureFile(write("probe.csv", plain), {}, reader);
    // The second block's first row, 0-based among the data rows.
    const joinRow = rowsBefore(plain, plans[0]!.starts[1]!);
    for (const edit of [
      (row: number, text: string) => (row === joinRow ? text.replace(/^[^,]*/, ((row - 1) / RATE).toFixed(5)) : text),
      (row: number, text: string) => (row >= joinRow ? text.replace(/^[^,]*/, ((row + 50) / RATE).toFixed(5)) : text),
    ]) {
      const path = write("join.csv", captureText({ edit }));
      const whole = await rejectionOf(readCaptureFile(path, {}));
      expect(whole.line).toBe(joinRow + 4);
      const split = await rejectionOf(readCaptureFile(path, {}, backOnThisThread));
      expect(split.message).toBe(whole.message);
      expect(split.line).toBe(whole.line);
    }
  });

  it("reads the file again from a block that holds more rows than were set aside for it, in one pass", async () => {
    // Padded numbers make every row long but those of a stretch inside the second block, which the line densities
    // sampled at the blocks' ends cannot see.
    const text = captureText({ edit: (row, line) => (row >= 180_000 && row < 260_000 ? line : line.split(",").map((field) => `   ${field}`).join(",")) });
    const path = write("dense.csv", text);
    const { reader, plans } = counting(helper.readBlocks);
    const split = await readCaptureFile(path, {}, reader);
    // Some block ends past the rows set aside up to its end, so whichever thread read it ran out of room.
    const { starts, rows } = plans[0]!;
    const overflowing = starts.slice(1).some((end, k) => rowsBefore(text, end) > rows[k + 1]!);
    expect(overflowing).toBe(true);
    expectSameCapture(split, await readCaptureFile(path, {}));
  });

  it("gives the CLI's analysis object unchanged when the helper reads and measures the harmonics", async () => {
    const path = write("analysis.csv", captureText());
    const withHelper = await analyzeCapture({ path }, { rating: { ratedPowerW: 1000, ratedVoltage: 230 } }, undefined, helper);
    const alone = await analyzeCapture({ path }, { rating: { ratedPowerW: 1000, ratedVoltage: 230 } });
    expect(withHelper).toEqual(alone);
    expect(withHelper.harmonics.orders.length).toBe(39);
  });
});
