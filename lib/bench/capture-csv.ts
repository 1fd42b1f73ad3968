// Capture reader: a scope or logger CSV (free-form header lines, a row of
// column names, then numeric rows) streamed into Float64Arrays, one per mapped
// quantity. Memory holds the mapped columns and one chunk, never the file.
//
// The data rows go through a byte-level tokenizer of our own, because on the
// 10-million-row benchmark papaparse (10 s) and csv-parse (39 s) were 3× and
// 13× slower than numpy.loadtxt (3.1 s), and the target is twice as fast as
// numpy: both build a string per field and an array per row. Runs of plain
// rows go through its WebAssembly part, capture-rows.wat, which reads them in
// about half the time the same loop took in JavaScript.

import { open, type FileHandle } from "node:fs/promises";
import { PLAIN_ROW_MAX_COLUMNS, plainRowParser } from "./capture-rows";

/** A rejected capture: `message` names the problem, `line` is 1-based, or null when no single line is at fault. */
export class CaptureError extends Error {
  readonly line: number | null;

  constructor(message: string, line: number | null) {
    super(line === null ? message : `line ${line}: ${message}`);
    this.name = "CaptureError";
    this.line = line;
  }

  /** The message without the "line N:" prefix, for callers that show the line apart. */
  get problem(): string {
    return this.line === null ? this.message : this.message.slice(`line ${this.line}: `.length);
  }
}

/** A column named as in the capture's header (case-insensitive, unit suffix optional) or by 1-based position. */
export type ColumnRef = string | number;

export interface ChannelMapping {
  /** Omitted: found by name, as when the whole mapping is omitted. */
  column?: ColumnRef;
  /** Multiplies the column into amperes, volts or °C: a 100 mV/A clamp read in volts is 10. */
  scale: number;
}

export type Quantity = "current" | "voltage" | "temperature";

export interface CaptureReadOptions {
  /** Omitted: found by name (current, I, amps…); null: none. The same for voltage and temperature. */
  current?: ChannelMapping | null;
  voltage?: ChannelMapping | null;
  temperature?: ChannelMapping | null;
  /** Omitted: found by name (time, t, timestamp, seconds…); null: no time column. */
  time?: ColumnRef | null;
  /** Seconds between samples, for captures without a time column. */
  sampleIntervalSeconds?: number;
  /** When given, the capture must be fast and long enough to analyse at this mains frequency. */
  mains?: { frequencyHz: number; minWholeCycles: number };
  /** Expected size in bytes, so the arrays are sized once instead of grown. */
  sizeHintBytes?: number;
  /** Quantities the caller cannot do without: missing, the capture is turned away at its header, not after its last row. */
  required?: Quantity[];
}

export interface HeaderEntry {
  key: string;
  value: string;
  line: number;
}

export interface Capture {
  sampleRateHz: number;
  sampleCount: number;
  durationSeconds: number;
  current: Float64Array | null;
  voltage: Float64Array | null;
  temperature: Float64Array | null;
  /** Column names as read (or "column N" when the file has no names row). */
  columns: string[];
  /** Which column each quantity came from; null when not mapped. */
  mapping: { time: string | null; current: string | null; voltage: string | null; temperature: string | null };
  timeSource: "seconds column" | "timestamp column" | "sample interval";
  delimiter: "," | ";" | "\t";
  header: HeaderEntry[];
  /** Line of the first numeric row. */
  firstDataLine: number;
}

export type CaptureData = string | Uint8Array | AsyncIterable<string | Uint8Array> | Iterable<string | Uint8Array>;

/** Reads capture bytes from memory or from a stream of chunks (object storage, an upload). */
export async function readCapture(data: CaptureData, options: CaptureReadOptions = {}): Promise<Capture> {
  const reader = new CaptureReader(options);
  if (typeof data === "string") reader.push(Buffer.from(data, "utf8"));
  else if (data instanceof Uint8Array) reader.push(data);
  else {
    for await (const chunk of data) reader.push(typeof chunk === "string" ? Buffer.from(chunk, "utf8") : chunk);
  }
  return reader.finish();
}

const READ_CHUNK_BYTES = 1 << 20;

/**
 * Reads the blocks of a capture file that the helper's side claims, on another thread (see readClaimedBlocks); the
 * header already read by the caller fixes the format.
 */
export type CaptureBlocksReader = (plan: CaptureBlockPlan) => Promise<CaptureBlockTally[]>;

/**
 * The rows after a large file's first read, cut at line starts into blocks that two threads claim one at a time,
 * this thread from the front and the helper from the back, so both stay busy until they meet whatever the speed
 * of each. The front stores its rows straight after the rows before them; a block read from the back is stored
 * at `rows[k]`, set aside from the line density sampled around it, as the rows before it are not known until
 * they are read.
 */
export interface CaptureBlockPlan {
  path: string;
  /** Byte offsets: block k holds the lines starting in [starts[k], starts[k + 1]). */
  starts: number[];
  /** Where block k's rows are stored when read from the back; rows[k + 1] − rows[k] rows are set aside for it. */
  rows: number[];
  /** The next block from the front (low 16 bits) and one past the next from the back (high 16 bits). */
  claims: Int32Array;
  format: RowFormat;
  channels: SharedChannels;
}

/**
 * What a block added, and the first problem in it (a CaptureError's problem and line). Lines are counted from the
 * block's start (its first line is 1); `full` says it stopped at the rows set aside for it, before its end.
 */
export interface CaptureBlockTally {
  block: number;
  row: number;
  rows: number;
  lines: number;
  firstTime: number;
  firstTimeLine: number;
  lastTime: number;
  largestInterval: number;
  largestIntervalLine: number;
  error: { problem: string; line: number | null } | null;
  full: boolean;
}

/** How data rows are laid out, fixed by the header: enough to read a range of them anywhere, another thread included. */
export interface RowFormat {
  delimiter: number;
  commaIsDecimal: boolean;
  roles: number[];
  columns: string[];
  scales: { current: number; voltage: number; temperature: number };
  hasTime: boolean;
  timestampBaseSeconds: number | null;
}

/** Channel arrays on shared memory, sized for every row the file could hold, written by both threads. */
export interface SharedChannels {
  current: Float64Array | null;
  voltage: Float64Array | null;
  temperature: Float64Array | null;
}

/** Below this size a second thread costs more to start than it saves. */
const SPLIT_MIN_BYTES = 8 << 20;
/** Small enough that the thread done first waits little for the other, large enough that a block's start-up is lost in it. */
const BLOCK_BYTES = 4 << 20;
/** Read first, on this thread alone: enough for the header and some rows, no more, as the other thread waits meanwhile. */
const FIRST_READ_BYTES = 256 << 10;
/** Bytes read at each block boundary, to find a line start and the density of lines there. */
const SAMPLE_BYTES = 64 << 10;
/** Rows set aside for a block beyond what the density around it foretells, so that a block rarely overflows. */
const RESERVE_MARGIN = 1.05;
const RESERVE_EXTRA_ROWS = 1024;

/**
 * Reads a capture file. Given a blocks reader (a helper thread), a large file's rows are read by both threads at
 * once, into shared arrays; the result, rejections included, is the same as reading it in one pass.
 */
export async function readCaptureFile(path: string, options: CaptureReadOptions = {}, readBlocks?: CaptureBlocksReader): Promise<Capture> {
  let handle;
  try {
    handle = await open(path, "r");
  } catch (error) {
    const code = (error as NodeJS.ErrnoException).code;
    throw new CaptureError(code === "ENOENT" ? `no such file: ${path}` : `cannot read ${path} (${code ?? "unknown error"})`, null);
  }
  try {
    const { size } = await handle.stat();
    const split = readBlocks !== undefined && size >= SPLIT_MIN_BYTES;
    const reader = new CaptureReader({ ...options, sizeHintBytes: options.sizeHintBytes ?? size }, split ? { sharedRowsForBytes: size } : undefined);
    // Where the reading in one pass starts: after the header and first rows when the file could not be split.
    let from = 0;
    if (split) {
      // The boundaries are sampled while the header and the first rows are read.
      const sampling = sampleBoundaries(handle, size);
      const first = Buffer.allocUnsafe(FIRST_READ_BYTES);
      const { bytesRead } = await handle.read(first, 0, FIRST_READ_BYTES, 0);
      reader.push(first.subarray(0, bytesRead));
      from = bytesRead - reader.dropCarry();
      const boundaries = await sampling;
      const plan = reader.inRows() && boundaries.length > 0 ? planBlocks(path, reader, from, size, boundaries) : null;
      if (plan !== null) {
        const [own, helper] = await Promise.allSettled([readClaimedBlocks(plan, "front"), readBlocks(plan)]);
        if (own.status === "rejected") throw own.reason;
        if (helper.status === "rejected") throw helper.reason;
        const tallies = [...own.value, ...helper.value].sort((a, b) => a.block - b.block);
        const full = tallies.findIndex((tally) => tally.full);
        reader.joinBlocks(...(full < 0 ? tallies : tallies.slice(0, full)));
        // A block held more rows than were set aside for it: from its start the file is read again here, in one pass.
        if (full >= 0) await readChunks(handle, reader, plan.starts[full] as number);
        return reader.finish();
      }
    }
    await readChunks(handle, reader, from);
    return reader.finish();
  } finally {
    await handle.close();
  }
}

/** Two buffers in turn, the next chunk read on libuv's thread pool while this one is parsed. */
function chunkBuffers(): [Buffer, Buffer] {
  return [Buffer.allocUnsafe(READ_CHUNK_BYTES), Buffer.allocUnsafe(READ_CHUNK_BYTES)];
}

async function readChunks(handle: FileHandle, reader: CaptureReader, from: number, to = Infinity, buffers = chunkBuffers()): Promise<void> {
  // The reader copies only a line cut at a chunk's end, so a buffer is free again once pushed.
  let position = from;
  const length = () => Math.min(READ_CHUNK_BYTES, to - position);
  let reading = handle.read(buffers[0] as Buffer, 0, length(), position);
  for (let turn = 1; ; turn++) {
    const { bytesRead, buffer } = await reading;
    if (bytesRead === 0) break;
    position += bytesRead;
    reading = handle.read(buffers[turn % 2] as Buffer, 0, Math.max(0, length()), position);
    // If parsing fails, this read is never awaited: its own failure must not go unhandled.
    reading.catch(() => undefined);
    reader.push(buffer.subarray(0, bytesRead));
  }
}

/** Where the blocks after the first read start (at line starts about BLOCK_BYTES apart), with the density of lines there. */
async function sampleBoundaries(handle: FileHandle, size: number): Promise<{ start: number; density: number }[]> {
  const nominal = Array.from({ length: Math.max(0, Math.ceil((size - FIRST_READ_BYTES) / BLOCK_BYTES) - 1) }, (_, k) => FIRST_READ_BYTES + (k + 1) * BLOCK_BYTES);
  const samples = await Promise.all(
    nominal.map(async (at) => {
      // Its own ArrayBuffer, so countLineFeeds's word view starts aligned.
      const bytes = new Uint8Array(SAMPLE_BYTES);
      const { bytesRead } = await handle.read(bytes, 0, SAMPLE_BYTES, at);
      const newline = bytes.subarray(0, bytesRead).indexOf(LF);
      const start = at + newline + 1;
      return newline < 0 || start >= size ? null : { start, density: countLineFeeds(bytes, bytesRead) / bytesRead };
    }),
  );
  return samples.filter((sample) => sample !== null);
}

/** Cuts the rows from `from` into blocks at the sampled line starts and sets rows aside for each. */
function planBlocks(path: string, reader: CaptureReader, from: number, size: number, boundaries: { start: number; density: number }[]): CaptureBlockPlan {
  const starts = [from, ...boundaries.map((boundary) => boundary.start), size];
  // A block is judged by the denser of the samples at its two ends (the first rows stand for the first block's start).
  const densities = [reader.rowDensity(), ...boundaries.map((boundary) => boundary.density)];
  const { row, format, channels } = reader.position();
  const rows = [row];
  for (let k = 0; k + 1 < starts.length; k++) {
    const bytes = (starts[k + 1] as number) - (starts[k] as number);
    const density = Math.max(densities[k] as number, densities[k + 1] ?? 0);
    rows.push((rows[k] as number) + Math.min(Math.ceil(bytes * density * RESERVE_MARGIN) + RESERVE_EXTRA_ROWS, reader.rowsAtMost(bytes)));
  }
  const blocks = starts.length - 1;
  if (blocks > 0xffff) throw new Error(`${blocks} blocks do not fit the claim word`);
  const claims = new Int32Array(new SharedArrayBuffer(Int32Array.BYTES_PER_ELEMENT)).fill(blocks << 16);
  return { path, starts, rows, claims, format, channels };
}

/** Takes the next unclaimed block from one side, or null once the two sides have met. */
function claimBlock(claims: Int32Array, side: "front" | "back"): number | null {
  for (;;) {
    const word = Atomics.load(claims, 0);
    const front = word & 0xffff;
    const back = word >>> 16;
    if (front >= back) return null;
    const next = side === "front" ? (front + 1) | (back << 16) : front | ((back - 1) << 16);
    if (Atomics.compareExchange(claims, 0, word, next) === word) return side === "front" ? front : back - 1;
  }
}

/**
 * Reads the plan's blocks one at a time, each claimed from this side until the two sides meet; a rejection is
 * returned in its block's tally, not thrown, so it can cross threads. The front stops at a block that overflows or
 * is rejected, as nothing after it will be joined; the back goes on, since the blocks before such a block still are.
 */
export async function readClaimedBlocks(plan: CaptureBlockPlan, side: "front" | "back"): Promise<CaptureBlockTally[]> {
  const handle = await open(plan.path, "r");
  try {
    const tallies: CaptureBlockTally[] = [];
    // One pair for every block: a pair each would leave megabytes to the garbage collector per block.
    const buffers = chunkBuffers();
    let frontRow = plan.rows[0] as number;
    for (let block = claimBlock(plan.claims, side); block !== null; block = claimBlock(plan.claims, side)) {
      const row = side === "front" ? frontRow : (plan.rows[block] as number);
      const reader = new CaptureReader({}, { range: { format: plan.format, channels: plan.channels, row, rowLimit: (plan.rows[block + 1] as number) - row } });
      let error: CaptureBlockTally["error"] = null;
      let full = false;
      try {
        await readChunks(handle, reader, plan.starts[block] as number, plan.starts[block + 1] as number, buffers);
        reader.flushLastLine();
      } catch (thrown) {
        if (thrown instanceof RowLimitReached) full = true;
        else if (thrown instanceof CaptureError) error = { problem: thrown.problem, line: thrown.line };
        else throw thrown;
      }
      const tally = reader.tally(block, error, full);
      tallies.push(tally);
      if (side === "front") {
        if (full || error !== null) break;
        frontRow += tally.rows;
      }
    }
    return tallies;
  } finally {
    await handle.close();
  }
}

/** A block reached the rows set aside for it: not a problem with the file, so not a CaptureError. */
class RowLimitReached extends Error {}

/** Line feeds four bytes at a time: a word holds one only when (x − 0x01010101) & ~x & 0x80808080 is set for x = word ^ 0x0a0a0a0a. */
function countLineFeeds(buffer: Uint8Array, length: number): number {
  const words = new Int32Array(buffer.buffer, buffer.byteOffset, length >> 2);
  let lines = 0;
  for (let k = 0; k < words.length; k++) {
    const x = (words[k] as number) ^ 0x0a0a0a0a;
    if (((x - 0x01010101) & ~x & 0x80808080) !== 0) {
      if ((x & 0xff) === 0) lines++;
      if ((x & 0xff00) === 0) lines++;
      if ((x & 0xff0000) === 0) lines++;
      if ((x & 0xff000000) === 0) lines++;
    }
  }
  for (let k = words.length << 2; k < length; k++) if (buffer[k] === LF) lines++;
  return lines;
}

/** Rejects a capture holding fewer whole cycles at `frequencyHz` than the analysis needs (it counts only whole cycles). */
export function assertEnoughCycles(sampleCount: number, sampleRateHz: number, frequencyHz: number, minWholeCycles: number): void {
  const cycles = Math.floor((sampleCount / sampleRateHz) * frequencyHz + 1e-9);
  if (cycles < minWholeCycles) {
    throw new CaptureError(
      `the capture holds ${cycles} whole cycle${cycles === 1 ? "" : "s"} of ${formatHz(frequencyHz)} mains ` +
        `(${formatSeconds(sampleCount / sampleRateHz)}); the analysis needs at least ${minWholeCycles}`,
      null,
    );
  }
}

/** Harmonics to the 40th need more than 80 samples a cycle (Nyquist). */
export const MIN_SAMPLES_PER_CYCLE = 80;

const LF = 10;
const CR = 13;
const TAB = 9;
const SPACE = 32;
const QUOTE = 34;
const HASH = 35;
const PLUS = 43;
const COMMA = 44;
const MINUS = 45;
const DOT = 46;
const ZERO = 48;
const SEMICOLON = 59;
const UPPER_E = 69;
const LOWER_E = 101;

const MAX_HEADER_LINES = 10_000;
const MAX_LINE_BYTES = 1 << 20;
const INITIAL_CAPACITY = 1 << 16;
/** Any 15 decimal digits fit a double's 53-bit mantissa exactly; longer numbers take the slow path. */
const FAST_PATH_DIGITS = 15;

// Roles of a column in a data row. TIME_TIMESTAMP is parsed on a slow path: loggers that write timestamps are slow loggers.
const SKIP = -1;
const TIME_SECONDS = 0;
const CURRENT = 1;
const VOLTAGE = 2;
const TEMPERATURE = 3;
const TIME_TIMESTAMP = 4;

const POWERS_OF_TEN = Array.from({ length: 23 }, (_, k) => Number(`1e${k}`));

const NUMBER_POINT = /^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$/;
const NUMBER_POINT_OR_COMMA = /^[+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+)(?:[eE][+-]?\d+)?$/;
const NOT_A_NUMBER = /^[+-]?(?:nan|inf|infinity)$/i;
const TIMESTAMP = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2})(?::(\d{2})(?:[.,](\d+))?)?(Z|[+-]\d{2}:?\d{2})?$/;
const CONTROL_CHARACTERS = /[\x00-\x08\x0e-\x1f\x7f]/;
const UNIT_CELL = /^[[(]?(?:s|ms|us|µs|v|mv|kv|a|ma|°c|c|k|w|%|div)?[\])]?$/i;

const NAME_PATTERNS: Record<"time" | Quantity, RegExp> = {
  time: /^(?:time|t|timestamp|date ?time|seconds?|sec|s|x-axis)$/i,
  current: /^(?:current|i|amps?|amperes?|load current|i_?load)$/i,
  voltage: /^(?:voltage|v|u|volts?|mains|mains voltage|line voltage|v_?line)$/i,
  temperature: /^(?:temperature|temp|t_?c|thermocouple|tc)$/i,
};

interface ResolvedColumns {
  time: number | null;
  current: number | null;
  voltage: number | null;
  temperature: number | null;
}

class CaptureReader {
  private readonly options: CaptureReadOptions;
  private line = 0;
  private bytesSeen = 0;
  private sawContent = false;
  private carry: Uint8Array | null = null;
  private inData = false;
  private readonly headerLines: { text: string; line: number }[] = [];
  private lastHeaderLine: number | null = null;

  // Set when the first numeric row is found.
  private delimiter = COMMA;
  private commaIsDecimal = false;
  private roles = new Int8Array(0);
  private columnCount = 0;
  private columns: string[] = [];
  private resolved: ResolvedColumns = { time: null, current: null, voltage: null, temperature: null };
  private header: HeaderEntry[] = [];
  private firstDataLine = 0;
  private headerBytes = 0;
  private dataBytes = 0;

  private capacity = 0;
  private rows = 0;
  private current: Float64Array | null = null;
  private voltage: Float64Array | null = null;
  private temperature: Float64Array | null = null;
  private scaleCurrent = 1;
  private scaleVoltage = 1;
  private scaleTemperature = 1;

  private hasTime = false;
  private firstTime = 0;
  private lastTime = 0;
  private timestampBaseSeconds: number | null = null;
  private largestInterval = 0;
  private largestIntervalLine = 0;
  /** Index of this reader's first row, and the line it was on: not 0 when reading a range of a file. */
  private firstRow = 0;
  private firstTimeLine = 0;
  private readonly sharedRowsForBytes: number | null = null;
  /** Reads a block of a file for readClaimedBlocks, into channels it was given. */
  private readonly readsRange: boolean = false;

  constructor(
    options: CaptureReadOptions,
    shared?: { sharedRowsForBytes: number } | { range: { format: RowFormat; channels: SharedChannels; row: number; rowLimit: number } },
  ) {
    this.options = options;
    if (shared === undefined) return;
    if ("sharedRowsForBytes" in shared) {
      this.sharedRowsForBytes = shared.sharedRowsForBytes;
      return;
    }
    const { format, channels, row, rowLimit } = shared.range;
    this.sawContent = true;
    this.inData = true;
    this.bytesSeen = 1;
    this.delimiter = format.delimiter;
    this.commaIsDecimal = format.commaIsDecimal;
    this.roles = Int8Array.from(format.roles);
    this.columnCount = format.roles.length;
    this.columns = format.columns;
    this.hasTime = format.hasTime;
    this.timestampBaseSeconds = format.timestampBaseSeconds;
    this.scaleCurrent = format.scales.current;
    this.scaleVoltage = format.scales.voltage;
    this.scaleTemperature = format.scales.temperature;
    this.current = channels.current;
    this.voltage = channels.voltage;
    this.temperature = channels.temperature;
    this.capacity = Math.min((channels.current ?? channels.voltage ?? channels.temperature)?.length ?? 0, row + rowLimit);
    this.rows = row;
    this.firstRow = row;
    this.readsRange = true;
  }

  inRows(): boolean {
    return this.inData;
  }

  /** Forgets a line cut at the end of what was pushed, to be read again from its start; returns its length in bytes. */
  dropCarry(): number {
    const length = this.carry?.length ?? 0;
    this.carry = null;
    return length;
  }

  /** Where the rows read so far end, and their format: where a plan's blocks start, and how to read them. */
  position(): Pick<CaptureBlockPlan, "format" | "channels"> & { row: number } {
    return {
      row: this.rows,
      format: {
        delimiter: this.delimiter,
        commaIsDecimal: this.commaIsDecimal,
        roles: Array.from(this.roles),
        columns: this.columns,
        scales: { current: this.scaleCurrent, voltage: this.scaleVoltage, temperature: this.scaleTemperature },
        hasTime: this.hasTime,
        timestampBaseSeconds: this.timestampBaseSeconds,
      },
      channels: { current: this.current, voltage: this.voltage, temperature: this.temperature },
    };
  }

  /** The last line of a file that does not end with a line feed. */
  flushLastLine(): void {
    if (this.carry === null) return;
    const last = new Uint8Array(this.carry.length + 1);
    last.set(this.carry);
    last[this.carry.length] = LF;
    this.carry = null;
    this.process(last, 0, last.length);
  }

  tally(block: number, error: CaptureBlockTally["error"], full: boolean): CaptureBlockTally {
    return {
      block,
      row: this.firstRow,
      rows: this.rows - this.firstRow,
      lines: this.line,
      firstTime: this.firstTime,
      firstTimeLine: this.firstTimeLine,
      lastTime: this.lastTime,
      largestInterval: this.largestInterval,
      largestIntervalLine: this.largestIntervalLine,
      error,
      full,
    };
  }

  /** The most rows `bytes` more of data can hold: a row takes at least a delimiter between columns, a character in each mapped one and a line feed. */
  rowsAtMost(bytes: number): number {
    return Math.floor(bytes / (this.columnCount + 1)) + 1;
  }

  /** Rows per byte of data so far. */
  rowDensity(): number {
    return this.dataBytes > 0 ? this.rows / this.dataBytes : 0;
  }

  /**
   * Takes in the blocks read after this reader's rows, in file order, as if it had read them itself: each block's
   * rows move down to follow the rows before them, its line numbers are counted on from the lines before it, the
   * time checks run across every join, and the first rejection in file order is thrown.
   */
  joinBlocks(...blocks: CaptureBlockTally[]): void {
    for (const block of blocks) {
      if (block.row !== this.rows) {
        for (const channel of [this.current, this.voltage, this.temperature]) channel?.copyWithin(this.rows, block.row, block.row + block.rows);
      }
      const lineOf = (line: number) => this.line + line;
      if (block.rows > 0 && this.hasTime) this.takeTime(block.firstTime, lineOf(block.firstTimeLine));
      if (block.error !== null) throw new CaptureError(block.error.problem, block.error.line === null ? null : lineOf(block.error.line));
      if (block.largestInterval > this.largestInterval) {
        this.largestInterval = block.largestInterval;
        this.largestIntervalLine = lineOf(block.largestIntervalLine);
      }
      if (block.rows > 0) this.lastTime = block.lastTime;
      this.rows += block.rows;
      this.line = lineOf(block.lines);
    }
  }

  push(chunk: Uint8Array): void {
    if (chunk.length === 0) return;
    // A plain Uint8Array view, whatever came in (Buffer or not), keeps the tokenizer's byte reads monomorphic.
    let bytes = new Uint8Array(chunk.buffer, chunk.byteOffset, chunk.length);
    if (this.bytesSeen === 0) bytes = this.checkStart(bytes);
    this.bytesSeen += chunk.length;

    const lastNewline = bytes.lastIndexOf(LF);
    if (this.carry !== null) {
      const firstNewline = bytes.indexOf(LF);
      if (firstNewline < 0) {
        this.appendCarry(bytes);
        return;
      }
      const joined = new Uint8Array(this.carry.length + firstNewline + 1);
      joined.set(this.carry);
      joined.set(bytes.subarray(0, firstNewline + 1), this.carry.length);
      this.carry = null;
      this.process(joined, 0, joined.length);
      this.process(bytes, firstNewline + 1, lastNewline + 1);
    } else if (lastNewline >= 0) {
      this.process(bytes, 0, lastNewline + 1);
    }
    if (lastNewline + 1 < bytes.length) this.appendCarry(bytes.subarray(lastNewline + 1));
  }

  finish(): Capture {
    this.flushLastLine();
    if (!this.sawContent) throw new CaptureError("empty file: there is nothing to read", null);
    if (!this.inData) {
      throw new CaptureError(
        "header without rows: no row of numbers follows the header (was the export cut short, or are the samples in another file?)",
        this.lastHeaderLine,
      );
    }
    const rows = this.rows;

    let sampleRateHz: number;
    if (this.hasTime) {
      if (rows < 2) throw new CaptureError("only one row of numbers: the sample rate needs at least two", this.firstDataLine);
      const meanInterval = (this.lastTime - this.firstTime) / (rows - 1);
      sampleRateHz = 1 / meanInterval;
      if (this.largestInterval > 1.5 * meanInterval) {
        throw new CaptureError(
          `gap in time: ${formatSeconds(this.largestInterval)} since the previous row where samples are ` +
            `${formatSeconds(meanInterval)} apart on average (samples missing?)`,
          this.largestIntervalLine,
        );
      }
    } else {
      sampleRateHz = 1 / (this.options.sampleIntervalSeconds as number);
    }

    const mains = this.options.mains;
    if (mains !== undefined) {
      const minRate = MIN_SAMPLES_PER_CYCLE * mains.frequencyHz;
      if (!(sampleRateHz > minRate)) {
        throw new CaptureError(
          `sample rate too low: ${formatRate(sampleRateHz)} for ${formatHz(mains.frequencyHz)} mains; ` +
            `harmonics to the 40th need more than ${formatRate(minRate)} (${MIN_SAMPLES_PER_CYCLE} samples a cycle)`,
          null,
        );
      }
      assertEnoughCycles(rows, sampleRateHz, mains.frequencyHz, mains.minWholeCycles);
    }

    const name = (index: number | null) => (index === null ? null : (this.columns[index] ?? null));
    return {
      sampleRateHz,
      sampleCount: rows,
      durationSeconds: rows / sampleRateHz,
      current: this.current?.subarray(0, rows) ?? null,
      voltage: this.voltage?.subarray(0, rows) ?? null,
      temperature: this.temperature?.subarray(0, rows) ?? null,
      columns: this.columns,
      mapping: {
        time: name(this.resolved.time),
        current: name(this.resolved.current),
        voltage: name(this.resolved.voltage),
        temperature: name(this.resolved.temperature),
      },
      timeSource: !this.hasTime ? "sample interval" : this.timestampBaseSeconds !== null ? "timestamp column" : "seconds column",
      delimiter: this.delimiter === TAB ? "\t" : this.delimiter === SEMICOLON ? ";" : ",",
      header: this.header,
      firstDataLine: this.firstDataLine,
    };
  }

  /** Strips a UTF-8 byte-order mark and turns away files that are not text. */
  private checkStart(bytes: Uint8Array): Uint8Array {
    if ((bytes[0] === 0xff && bytes[1] === 0xfe) || (bytes[0] === 0xfe && bytes[1] === 0xff)) {
      throw new CaptureError("binary data: the file is UTF-16 text; export or save the capture as UTF-8 (or ASCII) CSV", 1);
    }
    const start = bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf ? 3 : 0;
    const probeEnd = Math.min(bytes.length, start + 8192);
    for (let p = start; p < probeEnd; p++) {
      if (bytes[p] === 0) {
        let line = 1;
        for (let q = start; q < p; q++) if (bytes[q] === LF) line++;
        throw new CaptureError("binary data: the file holds NUL bytes, so it is not a CSV text export", line);
      }
    }
    return bytes.subarray(start);
  }

  private appendCarry(bytes: Uint8Array): void {
    const previous = this.carry?.length ?? 0;
    if (previous + bytes.length > MAX_LINE_BYTES) {
      throw new CaptureError("binary data: a line longer than 1 MiB, so the file is not a CSV capture", this.line + 1);
    }
    const joined = new Uint8Array(previous + bytes.length);
    if (this.carry !== null) joined.set(this.carry);
    joined.set(bytes, previous);
    this.carry = joined;
  }

  /** Handles complete lines in bytes[start, end). */
  private process(bytes: Uint8Array, start: number, end: number): void {
    let p = start;
    while (!this.inData && p < end) {
      // Only complete lines come in, so a line feed is always found before `end`.
      const lineEnd = bytes.indexOf(LF, p);
      this.line++;
      const text = Buffer.from(bytes.buffer, bytes.byteOffset + p, lineEnd - p).toString("utf8").replace(/\r$/, "");
      if (this.headerLine(text)) {
        // The first numeric row is parsed again by the data path so that every row goes through the same checks.
        this.line--;
        break;
      }
      this.headerBytes += lineEnd + 1 - p;
      p = lineEnd + 1;
    }
    if (this.inData && p < end) this.parseRows(bytes, p, end);
  }

  /** Returns true when text is the first numeric row. */
  private headerLine(text: string): boolean {
    if (text.trim() === "") return false;
    this.sawContent = true;
    if (CONTROL_CHARACTERS.test(text)) throw new CaptureError("binary data: control characters in a text line", this.line);
    if (text.trimStart().startsWith("#")) {
      this.lastHeaderLine = this.line;
      return false;
    }
    const row = splitNumericRow(text);
    if (row === null) {
      if (this.headerLines.length >= MAX_HEADER_LINES) {
        throw new CaptureError(`header without rows: no row of numbers in the first ${MAX_HEADER_LINES} lines`, this.line);
      }
      this.headerLines.push({ text, line: this.line });
      this.lastHeaderLine = this.line;
      return false;
    }
    this.startData(row);
    return true;
  }

  private startData(row: { delimiter: number; fields: string[] }): void {
    this.delimiter = row.delimiter;
    this.commaIsDecimal = row.delimiter !== COMMA;
    this.columnCount = row.fields.length;
    this.firstDataLine = this.line;
    const delimiterText = String.fromCharCode(row.delimiter);

    // The names row is the last header line; a row of units (s, V, A) under it is read as units, not names.
    let namesAt = this.headerLines.length - 1;
    const lastRow = this.headerLines[namesAt];
    if (lastRow !== undefined) {
      const cells = splitCells(lastRow.text, delimiterText);
      const above = this.headerLines[namesAt - 1];
      if (
        above !== undefined &&
        cells.length === this.columnCount &&
        cells.every((cell) => UNIT_CELL.test(cell)) &&
        splitCells(above.text, delimiterText).length === this.columnCount
      ) {
        namesAt--;
      }
    }
    const namesRow = this.headerLines[namesAt];
    if (namesRow === undefined) {
      this.columns = row.fields.map((_, k) => `column ${k + 1}`);
    } else {
      const names = splitCells(namesRow.text, delimiterText);
      const isNumber = (cell: string) => isNumberLike(cell, this.commaIsDecimal);
      const numeric = names.filter(isNumber).length;
      const above = this.headerLines[namesAt - 1];
      const aboveCells = above === undefined ? null : splitCells(above.text, delimiterText);
      const namesAbove = aboveCells !== null && aboveCells.length === names.length && !aboveCells.some(isNumber) ? aboveCells : null;
      // A "names" row that is mostly numbers, or partly numbers under a row of names, is a data row with text in it.
      if (numeric * 2 > names.length || (numeric > 0 && namesAbove !== null)) {
        const index = names.findIndex((cell) => !isNumber(cell));
        const column = namesAbove === null ? `${index + 1}` : `${index + 1} ("${namesAbove[index]}")`;
        throw new CaptureError(`text in numbers: "${clip(names[index] ?? "")}" in column ${column} is not a number`, namesRow.line);
      }
      if (names.length !== this.columnCount) {
        throw new CaptureError(
          `ragged rows: ${this.columnCount} value${this.columnCount === 1 ? "" : "s"} on this line but ` +
            `${names.length} column name${names.length === 1 ? "" : "s"} on line ${namesRow.line}`,
          this.line,
        );
      }
      this.columns = names.map((name, k) => (name === "" ? `column ${k + 1}` : name));
    }
    this.header = this.headerLines.slice(0, Math.max(namesAt, 0)).map(({ text, line }) => parseHeaderEntry(text, line, delimiterText));

    this.resolveColumns(namesRow?.line ?? this.line, row.fields);
    this.inData = true;
  }

  private resolveColumns(namesLine: number, firstRow: string[]): void {
    const { options } = this;
    const used = new Map<number, string>();
    const take = (ref: ColumnRef, what: string): number => {
      const index = findColumn(ref, this.columns, namesLine);
      const other = used.get(index);
      if (other !== undefined) {
        throw new CaptureError(`column ${describeColumn(index, this.columns)} is mapped to both ${other} and ${what}`, namesLine);
      }
      used.set(index, what);
      return index;
    };
    const detect = (pattern: RegExp): number | null => {
      const index = this.columns.findIndex((name, k) => !used.has(k) && pattern.test(baseName(name)));
      return index < 0 ? null : index;
    };

    const interval = options.sampleIntervalSeconds;
    if (interval !== undefined && !(Number.isFinite(interval) && interval > 0)) {
      throw new CaptureError(`the sample interval must be a positive number of seconds, got ${interval}`, null);
    }
    if (options.time !== undefined && options.time !== null && interval !== undefined) {
      throw new CaptureError("give either a time column or a sample interval, not both", null);
    }
    let time: number | null = null;
    if (options.time !== undefined && options.time !== null) time = take(options.time, "time");
    else if (options.time === undefined && interval === undefined) {
      time = detect(NAME_PATTERNS.time);
      if (time !== null) used.set(time, "time");
    }

    const channel = (quantity: Quantity): number | null => {
      const mapping = options[quantity];
      if (mapping === null) return null;
      if (mapping !== undefined && (!Number.isFinite(mapping.scale) || mapping.scale === 0)) {
        throw new CaptureError(`the ${quantity} scale must be a finite, non-zero number, got ${mapping.scale}`, null);
      }
      if (mapping?.column !== undefined) return take(mapping.column, quantity);
      const found = detect(NAME_PATTERNS[quantity]);
      if (found !== null) used.set(found, quantity);
      return found;
    };
    let current = channel("current");
    const voltage = channel("voltage");
    const temperature = channel("temperature");
    // A two-column capture (time and one channel) is a current capture unless told otherwise.
    if (current === null && options.current?.column === undefined && voltage === null && temperature === null) {
      const free = this.columns.map((_, k) => k).filter((k) => !used.has(k));
      if (free.length === 1 && free[0] !== undefined) {
        current = free[0];
        used.set(current, "current");
      }
    }
    const found = { current, voltage, temperature };
    for (const quantity of options.required ?? []) {
      if (found[quantity] === null) {
        throw new CaptureError(
          `no ${quantity} column recognised among ${this.columns.map((n) => `"${n}"`).join(", ")}: name it (by column name or 1-based number)`,
          namesLine,
        );
      }
    }
    if (current === null && voltage === null && temperature === null) {
      throw new CaptureError(
        `no current, voltage or temperature column recognised among ${this.columns.map((n) => `"${n}"`).join(", ")}: ` +
          "name them (by column name or 1-based number)",
        namesLine,
      );
    }
    if (time === null && interval === undefined) {
      throw new CaptureError("no time column found: name it, or give the sample interval in seconds", namesLine);
    }
    this.resolved = { time, current, voltage, temperature };

    this.roles = new Int8Array(this.columnCount).fill(SKIP);
    if (time !== null) {
      const first = (firstRow[time] ?? "").trim().replace(/^"|"$/g, "");
      this.roles[time] = TIMESTAMP.test(first) ? TIME_TIMESTAMP : TIME_SECONDS;
      this.hasTime = true;
    }
    if (current !== null) this.roles[current] = CURRENT;
    if (voltage !== null) this.roles[voltage] = VOLTAGE;
    if (temperature !== null) this.roles[temperature] = TEMPERATURE;
    this.scaleCurrent = options.current?.scale ?? 1;
    this.scaleVoltage = options.voltage?.scale ?? 1;
    this.scaleTemperature = options.temperature?.scale ?? 1;

    const shared = this.sharedRowsForBytes;
    // Shared arrays cannot grow under another thread's writes, so they are sized for the most rows the file can
    // hold; pages never written take no memory.
    this.capacity = shared === null ? INITIAL_CAPACITY : this.rowsAtMost(shared);
    const allocate = () =>
      shared === null ? new Float64Array(this.capacity) : new Float64Array(new SharedArrayBuffer(this.capacity * Float64Array.BYTES_PER_ELEMENT));
    if (current !== null) this.current = allocate();
    if (voltage !== null) this.voltage = allocate();
    if (temperature !== null) this.temperature = allocate();
  }

  /** Sizes the arrays from the bytes a row takes so far when the total size is known, else grows by half. */
  private grow(dataBytesRead: number): void {
    if (this.readsRange) throw new RowLimitReached();
    if ((this.current ?? this.voltage ?? this.temperature)?.buffer instanceof SharedArrayBuffer) throw new Error("shared capture arrays are sized for every row the file can hold; a row beyond that is a bug");
    const hint = this.options.sizeHintBytes;
    let next = Math.ceil(this.capacity * 1.5);
    if (hint !== undefined && this.rows > 0 && dataBytesRead > 0) {
      const bytesPerRow = dataBytesRead / this.rows;
      const expected = Math.ceil(((hint - this.headerBytes) / bytesPerRow) * 1.02) + 1024;
      next = Math.max(expected, Math.ceil(this.capacity * 1.25));
    }
    const resize = (array: Float64Array | null) => {
      if (array === null) return null;
      const larger = new Float64Array(next);
      larger.set(array);
      return larger;
    };
    this.current = resize(this.current);
    this.voltage = resize(this.voltage);
    this.temperature = resize(this.temperature);
    this.capacity = next;
  }

  // Most rows hold nothing but plain numbers (a minus, digits, a decimal mark and digits, an exponent) between
  // delimiters: capture-rows.wat reads runs of those. Any other line (blank, a comment, blanks or quotes around a
  // number, a plus, a timestamp, an unmapped column, many digits, another count of fields, a time that does not
  // increase, anything wrong) goes to readLine, which reads every line the full way, gives the same number the same
  // value, and rejects what it cannot read.
  private parseRows(bytes: Uint8Array, start: number, end: number): void {
    const roles = this.roles;
    // Off for the rest of the chunk once a row needs the full loop: the next rows are likely written the same way.
    let plainRows = !roles.includes(TIME_TIMESTAMP) && !roles.includes(SKIP) && roles.length <= PLAIN_ROW_MAX_COLUMNS;
    const plain = plainRows ? plainRowParser() : null;
    plain?.configure({
      delimiter: this.delimiter,
      commaIsDecimal: this.commaIsDecimal,
      roles,
      hasTime: this.hasTime,
      scales: { current: this.scaleCurrent, voltage: this.scaleVoltage, temperature: this.scaleTemperature },
      channels: { current: this.current !== null, voltage: this.voltage !== null, temperature: this.temperature !== null },
    });
    let p = start;
    while (p < end) {
      if (plain !== null && plainRows) {
        // A range's rows end at its capacity: the row after them is left to the full loop to turn away.
        if (this.rows === this.capacity && !this.readsRange) this.grow(this.dataBytes + p - start);
        if (this.rows < this.capacity) {
          const read = plain.read(bytes, p, end, this.capacity - this.rows, this.rows === this.firstRow, this.lastTime);
          if (read.rows > 0) {
            plain.copyRows(read.rows, this.rows, this.current, this.voltage, this.temperature);
            if (this.hasTime) {
              if (this.rows === this.firstRow) {
                this.firstTime = read.firstTime;
                this.firstTimeLine = this.line + 1;
              }
              if (read.largestInterval > this.largestInterval) {
                this.largestInterval = read.largestInterval;
                this.largestIntervalLine = this.line + read.largestIntervalRow + 1;
              }
              this.lastTime = read.lastTime;
            }
            this.rows += read.rows;
            this.line += read.rows;
            p = read.next;
            continue;
          }
        }
      }
      this.line++;
      const next = this.readLine(bytes, p, end);
      if (next < 0) {
        p = -next;
        continue;
      }
      p = next;
      plainRows = false;
      const values = this.lineValues;
      if (this.hasTime) this.takeTime(values[TIME_SECONDS] as number, this.line);
      if (this.rows === this.capacity) this.grow(this.dataBytes + p - start);
      if (this.current !== null) this.current[this.rows] = (values[CURRENT] as number) * this.scaleCurrent;
      if (this.voltage !== null) this.voltage[this.rows] = (values[VOLTAGE] as number) * this.scaleVoltage;
      if (this.temperature !== null) this.temperature[this.rows] = (values[TEMPERATURE] as number) * this.scaleTemperature;
      this.rows++;
    }
    this.dataBytes += end - start;
  }

  /** The time checks for the row about to become row this.rows, on `line`: the first time, or a step that must be positive. */
  private takeTime(time: number, line: number): void {
    if (this.rows === this.firstRow) {
      this.firstTime = time;
      this.firstTimeLine = line;
    } else {
      const interval = time - this.lastTime;
      if (!(interval > 0)) throw timeNotIncreasing(time, this.lastTime, line);
      if (interval > this.largestInterval) {
        this.largestInterval = interval;
        this.largestIntervalLine = line;
      }
    }
    this.lastTime = time;
  }

  /** readLine's values for the row it read, by role (TIME_SECONDS for either time column). */
  private readonly lineValues = new Float64Array(4);

  /**
   * Reads the line from `p` (line number this.line) the full way: a blank or comment line, which holds no row, or a
   * row of any form the reader accepts, whose values go to lineValues. Returns where the next line starts, negated
   * for a line without a row; rejects a row it cannot read.
   */
  private readLine(bytes: Uint8Array, p: number, end: number): number {
    const delimiter = this.delimiter;
    const commaIsDecimal = this.commaIsDecimal;
    const roles = this.roles;
    const columnCount = this.columnCount;
    const line = this.line;
    let c = bytes[p] as number;
    if (c === LF || (c === CR && bytes[p + 1] === LF)) return -(p + (c === LF ? 1 : 2));
    if (c === HASH) return -(bytes.indexOf(LF, p) + 1);
    if (c === SPACE || c === TAB) {
      // A line of nothing but blanks is a blank line, as it is in the header.
      let q = p;
      while (bytes[q] === SPACE || bytes[q] === TAB || bytes[q] === CR) q++;
      if (bytes[q] === LF) return -(q + 1);
    }
    let field = 0;
    let time = 0;
    let currentValue = 0;
    let voltageValue = 0;
    let temperatureValue = 0;
    for (;;) {
      const fieldStart = p;
      const role = field < columnCount ? (roles[field] as number) : SKIP;
      if (role === SKIP || role === TIME_TIMESTAMP) {
        while (p < end) {
          c = bytes[p] as number;
          if (c === delimiter || c === LF || c === CR) break;
          p++;
        }
        if (role === TIME_TIMESTAMP) time = this.timestampSeconds(bytes, fieldStart, p, line, field);
      } else {
        c = bytes[p] as number;
        while (c === SPACE || c === QUOTE) c = bytes[++p] as number;
        let negative = false;
        if (c === MINUS || c === PLUS) {
          negative = c === MINUS;
          c = bytes[++p] as number;
        }
        const numberStart = p;
        let mantissa = 0;
        let digit = c - ZERO;
        while (digit >= 0 && digit <= 9) {
          mantissa = mantissa * 10 + digit;
          digit = (bytes[++p] as number) - ZERO;
        }
        let digits = p - numberStart;
        let exponent = 0;
        c = digit + ZERO;
        if (c === DOT || (c === COMMA && commaIsDecimal)) {
          const fractionStart = ++p;
          digit = (bytes[p] as number) - ZERO;
          while (digit >= 0 && digit <= 9) {
            mantissa = mantissa * 10 + digit;
            digit = (bytes[++p] as number) - ZERO;
          }
          exponent = fractionStart - p;
          digits += p - fractionStart;
          c = digit + ZERO;
        }
        let value: number;
        if (digits > 0 && digits <= FAST_PATH_DIGITS && (c === delimiter || c === LF)) {
          // The common field ends at its last digit: no exponent, padding or quotes to look for.
          value = exponent === 0 ? mantissa : mantissa / (POWERS_OF_TEN[-exponent] as number);
        } else {
          if (digits > 0 && (c === UPPER_E || c === LOWER_E)) {
            c = bytes[++p] as number;
            let exponentNegative = false;
            if (c === MINUS || c === PLUS) {
              exponentNegative = c === MINUS;
              c = bytes[++p] as number;
            }
            const exponentStart = p;
            let written = 0;
            while (c >= ZERO && c <= ZERO + 9) {
              if (written < 10_000) written = written * 10 + (c - ZERO);
              c = bytes[++p] as number;
            }
            if (p === exponentStart) digits = 0;
            exponent += exponentNegative ? -written : written;
          }
          const numberEnd = p;
          while (c === SPACE || c === QUOTE) c = bytes[++p] as number;
          if (digits === 0 || !(c === delimiter || c === LF || c === CR)) throw this.numberError(bytes, fieldStart, end, field);
          // Exact when the digits fit 2^53 and |exponent| ≤ 22: one correctly rounded multiply or divide.
          if (digits > FAST_PATH_DIGITS || exponent > 22 || exponent < -22) {
            value = slowNumber(bytes, numberStart, numberEnd);
            if (!Number.isFinite(value)) throw this.numberError(bytes, fieldStart, end, field);
          } else if (exponent === 0) value = mantissa;
          else if (exponent > 0) value = mantissa * (POWERS_OF_TEN[exponent] as number);
          else value = mantissa / (POWERS_OF_TEN[-exponent] as number);
        }
        if (negative) value = -value;
        if (role === CURRENT) currentValue = value;
        else if (role === VOLTAGE) voltageValue = value;
        else if (role === TIME_SECONDS) time = value;
        else temperatureValue = value;
      }
      field++;
      if (p >= end) break;
      c = bytes[p] as number;
      if (c === delimiter) {
        p++;
        continue;
      }
      if (c === CR) c = bytes[++p] as number;
      if (c === LF) {
        p++;
        break;
      }
      throw new CaptureError("binary data: a carriage return inside a row", line);
    }
    if (field !== columnCount) {
      throw new CaptureError(
        `ragged rows: ${field} value${field === 1 ? "" : "s"} where the column names give ${columnCount}`,
        line,
      );
    }
    const values = this.lineValues;
    values[TIME_SECONDS] = time;
    values[CURRENT] = currentValue;
    values[VOLTAGE] = voltageValue;
    values[TEMPERATURE] = temperatureValue;
    return p;
  }

  private numberError(bytes: Uint8Array, fieldStart: number, end: number, field: number): CaptureError {
    let fieldEnd = fieldStart;
    while (fieldEnd < end) {
      const c = bytes[fieldEnd];
      if (c === this.delimiter || c === LF || c === CR) break;
      fieldEnd++;
    }
    const text = Buffer.from(bytes.buffer, bytes.byteOffset + fieldStart, fieldEnd - fieldStart).toString("utf8").trim();
    const where = `in column ${describeColumn(field, this.columns)}`;
    if (CONTROL_CHARACTERS.test(text)) return new CaptureError(`binary data ${where}`, this.line);
    const unquoted = text.replace(/"/g, "");
    if (NOT_A_NUMBER.test(unquoted) || NUMBER_POINT_OR_COMMA.test(unquoted)) {
      return new CaptureError(`NaN or infinity in numbers: "${clip(unquoted)}" ${where}; only finite numbers can be analysed`, this.line);
    }
    if (text === "") return new CaptureError(`text in numbers: an empty value ${where}`, this.line);
    return new CaptureError(`text in numbers: "${clip(text)}" ${where} is not a number`, this.line);
  }

  private timestampSeconds(bytes: Uint8Array, start: number, end: number, line: number, field: number): number {
    const text = Buffer.from(bytes.buffer, bytes.byteOffset + start, end - start).toString("utf8").trim().replace(/^"|"$/g, "");
    const match = TIMESTAMP.exec(text);
    if (match === null) {
      throw new CaptureError(
        `text in numbers: "${clip(text)}" in column ${describeColumn(field, this.columns)} is not an ISO 8601 timestamp like the first row's`,
        line,
      );
    }
    const [, year, month, day, hour, minute, second, fraction, zone] = match;
    let whole =
      Date.UTC(Number(year), Number(month) - 1, Number(day), Number(hour), Number(minute), Number(second ?? 0)) / 1000;
    // Timestamps without a zone are taken as one clock: only differences between them matter.
    if (zone !== undefined && zone !== "Z") {
      const sign = zone.startsWith("-") ? -1 : 1;
      const digits = zone.slice(1).replace(":", "");
      whole -= sign * (Number(digits.slice(0, 2)) * 3600 + Number(digits.slice(2)) * 60);
    }
    // Relative to the first row, so sub-millisecond fractions keep their precision next to an epoch of 1.7e9 s.
    if (this.timestampBaseSeconds === null) this.timestampBaseSeconds = whole;
    return whole - this.timestampBaseSeconds + (fraction === undefined ? 0 : Number(`0.${fraction}`));
  }
}

function timeNotIncreasing(time: number, lastTime: number, line: number): CaptureError {
  return new CaptureError(
    `time not increasing: ${time} s follows ${lastTime} s on the row before (rows out of order, or times printed with too few digits?)`,
    line,
  );
}

function slowNumber(bytes: Uint8Array, start: number, end: number): number {
  return Number(Buffer.from(bytes.buffer, bytes.byteOffset + start, end - start).toString("latin1").replace(",", "."));
}

function isNumberLike(text: string, commaIsDecimal: boolean): boolean {
  const cell = text.trim().replace(/^"(.*)"$/, "$1").trim();
  return (commaIsDecimal ? NUMBER_POINT_OR_COMMA : NUMBER_POINT).test(cell) || NOT_A_NUMBER.test(cell) || TIMESTAMP.test(cell);
}

/** A line is a numeric row when, split on tab, semicolon or comma (first present wins), every cell is a number. */
function splitNumericRow(text: string): { delimiter: number; fields: string[] } | null {
  const delimiter = text.includes("\t") ? TAB : text.includes(";") ? SEMICOLON : COMMA;
  const fields = text.split(String.fromCharCode(delimiter));
  return fields.every((field) => isNumberLike(field, delimiter !== COMMA)) ? { delimiter, fields } : null;
}

function splitCells(text: string, delimiter: string): string[] {
  return text.split(delimiter).map((cell) => cell.trim().replace(/^"(.*)"$/, "$1").trim());
}

function parseHeaderEntry(text: string, line: number, delimiter: string): HeaderEntry {
  const body = text.trim().replace(/^#\s*/, "");
  const colon = body.indexOf(":");
  const split = body.indexOf(delimiter);
  const at = colon >= 0 && (split < 0 || colon < split) ? colon : split;
  if (at < 0) return { key: body, value: "", line };
  const value = splitCells(body.slice(at + 1), delimiter).filter((cell) => cell !== "").join(" ");
  return { key: body.slice(0, at).trim().replace(/^"(.*)"$/, "$1"), value, line };
}

/** "Current (A)" and "Current [A]" answer to "current". */
function baseName(name: string): string {
  return name.replace(/\s*[[(][^\])]*[\])]\s*$/, "").trim();
}

function findColumn(ref: ColumnRef, columns: string[], namesLine: number): number {
  if (typeof ref === "number") {
    if (!Number.isInteger(ref) || ref < 1 || ref > columns.length) {
      throw new CaptureError(`there is no column ${ref}: the capture has ${columns.length} (${listColumns(columns)})`, namesLine);
    }
    return ref - 1;
  }
  const wanted = ref.trim().toLowerCase();
  let index = columns.findIndex((name) => name.toLowerCase() === wanted);
  if (index < 0) index = columns.findIndex((name) => baseName(name).toLowerCase() === wanted);
  if (index < 0) throw new CaptureError(`no column named "${ref}": the columns are ${listColumns(columns)}`, namesLine);
  return index;
}

function listColumns(columns: string[]): string {
  return columns.map((name, k) => `${k + 1} "${name}"`).join(", ");
}

function describeColumn(index: number, columns: string[]): string {
  const name = columns[index];
  return name === undefined ? `${index + 1}` : `${index + 1} ("${name}")`;
}

function clip(text: string): string {
  return text.length > 24 ? `${text.slice(0, 24)}…` : text;
}

function formatSeconds(seconds: number): string {
  if (seconds >= 1) return `${Number(seconds.toPrecision(4))} s`;
  if (seconds >= 1e-3) return `${Number((seconds * 1e3).toPrecision(4))} ms`;
  return `${Number((seconds * 1e6).toPrecision(4))} µs`;
}

function formatRate(rateHz: number): string {
  return `${Number(rateHz.toPrecision(4))} S/s`;
}

function formatHz(frequencyHz: number): string {
  return `${Number(frequencyHz.toPrecision(4))} Hz`;
}
