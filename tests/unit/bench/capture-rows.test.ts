// The WebAssembly reader of plain rows, on its own: what it takes, where it stops, and that the module shipped is
// the one its source assembles to. Through the CSV reader it is tested in capture-csv.test.ts and capture-split.test.ts.

import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { readCapture } from "@/lib/bench/capture-csv";
import { PlainRowParser, type PlainRowFormat } from "@/lib/bench/capture-rows";
import { assembleCaptureRows, captureRowsModuleSource, MODULE_PATH } from "@/scripts/build-wasm";

const COMMA = 44;
const SEMICOLON = 59;

/** Time, current and voltage, comma-separated, with the current scaled by 10. */
const format: PlainRowFormat = {
  delimiter: COMMA,
  commaIsDecimal: false,
  roles: Int8Array.from([0, 1, 2]),
  hasTime: true,
  scales: { current: 10, voltage: 1, temperature: 1 },
  channels: { current: true, voltage: true, temperature: false },
};

const bytesOf = (text: string) => new TextEncoder().encode(text);

function parser(rowFormat: PlainRowFormat = format): PlainRowParser {
  const made = new PlainRowParser();
  made.configure(rowFormat);
  return made;
}

/** Reads all it takes from `start`, as the CSV reader does, and returns the channels' values. */
function readValues(made: PlainRowParser, bytes: Uint8Array, rows: number) {
  const current = new Float64Array(rows);
  const voltage = new Float64Array(rows);
  let at = 0;
  let p = 0;
  let lastTime = 0;
  while (p < bytes.length) {
    const read = made.read(bytes, p, bytes.length, rows - at, at === 0, lastTime);
    if (read.rows === 0) break;
    made.copyRows(read.rows, at, current, voltage, null);
    at += read.rows;
    lastTime = read.lastTime;
    p = read.next;
  }
  return { current: current.subarray(0, at), voltage: voltage.subarray(0, at), next: p };
}

describe("the plain-row reader in WebAssembly", () => {
  it("ships the module that capture-rows.wat assembles to", async () => {
    expect(readFileSync(MODULE_PATH, "utf8")).toBe(captureRowsModuleSource(await assembleCaptureRows()));
  });

  it("reads plain numbers as JavaScript does, scaled, and reports the time steps", () => {
    const made = parser();
    const bytes = bytesOf("0,1.5,-230.25\n0.001,-0.125,2e2\n0.003,7E-1,-0\r\n0.0035,12,3.5\n");
    const read = made.read(bytes, 0, bytes.length, 100, true, 0);
    expect(read).toMatchObject({ next: bytes.length, rows: 4, firstTime: 0, lastTime: 0.0035 });
    // The largest step, 0.001 → 0.003, ends on the third row (index 2).
    expect(read.largestInterval).toBe(0.003 - 0.001);
    expect(read.largestIntervalRow).toBe(2);
    const current = new Float64Array(4);
    const voltage = new Float64Array(4);
    made.copyRows(read.rows, 0, current, voltage, null);
    expect(Array.from(current)).toEqual([15, -1.25, 7, 120]);
    expect(Array.from(voltage)).toEqual([-230.25, 200, -0, 3.5]);
    expect(Object.is(voltage[2], -0)).toBe(true);
  });

  it("stops at the start of a line it does not take, leaving it whole for the full reading", () => {
    const lines = ["0,1,2", "0.001,1,2"];
    const notPlain = ["0.002, 1,2", "0.002,+1,2", '0.002,"1",2', "0.002,1", "0.002,1,2,3", "0.002,1,2x", "0.002,1234567890123456,2", "0.002,1e23,2", "0.002,.,2", "", "# note", "0.001,1,2", "0.0005,1,2", "0.002,nan,2"];
    for (const line of notPlain) {
      const text = [...lines, line, "0.003,1,2", ""].join("\n");
      const read = parser().read(bytesOf(text), 0, text.length, 100, true, 0);
      expect({ line, next: read.next, rows: read.rows }).toEqual({ line, next: lines.join("\n").length + 1, rows: 2 });
    }
  });

  it("takes the row after the reader's first without a step before it only when told it is the first", () => {
    const bytes = bytesOf("5,1,2\n6,1,2\n");
    expect(parser().read(bytes, 0, bytes.length, 100, false, 5).rows).toBe(0);
    expect(parser().read(bytes, 0, bytes.length, 100, false, 4)).toMatchObject({ rows: 2, largestInterval: 1, largestIntervalRow: 0 });
    expect(parser().read(bytes, 0, bytes.length, 100, true, 99)).toMatchObject({ rows: 2, firstTime: 5, lastTime: 6 });
  });

  it("reads no more rows than it is given room for", () => {
    const bytes = bytesOf("0,1,2\n1,1,2\n2,1,2\n");
    const read = parser().read(bytes, 0, bytes.length, 2, true, 0);
    expect(read).toMatchObject({ rows: 2, next: "0,1,2\n1,1,2\n".length });
  });

  it("reads semicolon rows with decimal commas, and rows without a time column", () => {
    const semicolons = parser({ ...format, delimiter: SEMICOLON, commaIsDecimal: true });
    const bytes = bytesOf("0;1,5;-2,25\n0,5;3;4\n");
    expect(Array.from(readValues(semicolons, bytes, 10).current)).toEqual([15, 30]);
    const untimed = parser({ ...format, roles: Int8Array.from([1, 2]), hasTime: false });
    // Without a time column the rows need not carry increasing times.
    expect(Array.from(readValues(untimed, bytesOf("1,2\n1,2\n"), 10).voltage)).toEqual([2, 2]);
  });

  it("reads a buffer larger than its window in whole lines, window after window", () => {
    const count = 150_000;
    const lines = Array.from({ length: count }, (_, k) => `${k / 1000},${((k % 200) - 100) / 8},${k % 977}.5`);
    const bytes = bytesOf(`${lines.join("\n")}\n`);
    expect(bytes.length).toBeGreaterThan(2.5 * (1 << 20));
    const { current, voltage, next } = readValues(parser(), bytes, count);
    expect(next).toBe(bytes.length);
    expect(current.length).toBe(count);
    expect(Array.from(current)).toEqual(lines.map((line) => Number(line.split(",")[1]) * 10));
    expect(Array.from(voltage)).toEqual(lines.map((line) => Number(line.split(",")[2])));
  });

  it("leaves a first line longer than its window to the full reading", () => {
    const long = `0,${"1".repeat(1 << 20)},2\n`;
    expect(parser().read(bytesOf(long), 0, long.length, 10, true, 0)).toMatchObject({ rows: 0, next: 0 });
  });

  it("keeps its place in a capture read from one large buffer with rows of every kind", async () => {
    // Plain rows, then a padded one (the full reading takes the rest of that chunk), across windows of the one buffer.
    const lines = Array.from({ length: 120_000 }, (_, k) => `${k / 5000},${k % 2 === 0 ? "" : "-"}${(k % 1000) / 100},${k % 325}`);
    lines[70_000] = ` ${lines[70_000]}`;
    const capture = await readCapture(["time,current,voltage", ...lines].join("\n"));
    expect(capture.sampleCount).toBe(lines.length);
    expect(Array.from(capture.current ?? [])).toEqual(lines.map((line) => Number(line.trim().split(",")[1])));
  });
});
