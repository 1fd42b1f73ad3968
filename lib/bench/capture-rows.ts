// The plain-row parser of capture-rows.wat, for the CSV reader: a window of complete lines goes into the module's
// memory, rows come out as values per channel. One instance per thread, made on first use: WebAssembly instances
// are not shared between threads, and a thread's readers never run at once (parseRows is synchronous).

import { CAPTURE_ROWS_WASM_BASE64 } from "./capture-rows-wasm";

// The memory layout of capture-rows.wat.
const POWERS_OF_TEN_AT = 0;
const ROLES_AT = 256;
const INPUT_AT = 4096;
/** Bytes of lines loaded at a time. */
const WINDOW_BYTES = 1 << 20;
/** Rows one call reads at most. */
const CALL_ROWS = 1 << 14;
const CURRENT_AT = INPUT_AT + WINDOW_BYTES;
const VOLTAGE_AT = CURRENT_AT + CALL_ROWS * 8;
const TEMPERATURE_AT = VOLTAGE_AT + CALL_ROWS * 8;
const MEMORY_BYTES = TEMPERATURE_AT + CALL_ROWS * 8;
const PAGE_BYTES = 1 << 16;

/** The most columns a plain row can have: one role byte each below the input. */
export const PLAIN_ROW_MAX_COLUMNS = INPUT_AT - ROLES_AT;

const LF = 10;

interface CaptureRowsExports {
  memory: WebAssembly.Memory;
  configure(
    columnCount: number,
    delimiter: number,
    commaIsDecimal: number,
    hasTime: number,
    scaleCurrent: number,
    scaleVoltage: number,
    scaleTemperature: number,
    outCurrent: number,
    outVoltage: number,
    outTemperature: number,
  ): void;
  parseRows(p: number, end: number, maxRows: number, first: number, lastTime: number): number;
  rows: WebAssembly.Global;
  firstTime: WebAssembly.Global;
  lastTime: WebAssembly.Global;
  largestInterval: WebAssembly.Global;
  largestIntervalRow: WebAssembly.Global;
}

/** How the rows are written, as the reader found it: roles 0 time in seconds, 1 current, 2 voltage, 3 temperature. */
export interface PlainRowFormat {
  delimiter: number;
  commaIsDecimal: boolean;
  roles: Int8Array;
  hasTime: boolean;
  scales: { current: number; voltage: number; temperature: number };
  channels: { current: boolean; voltage: boolean; temperature: boolean };
}

/** What one call of read() took. */
export interface PlainRowsRead {
  /** Where it stopped, in the caller's bytes: a line start, the end of the window, or a line it did not take. */
  next: number;
  rows: number;
  /** The first row's time, when `first` was set and a row was read. */
  firstTime: number;
  lastTime: number;
  /** The largest time step between the rows it read, and the index among them of the row it ended on (-1 for none). */
  largestInterval: number;
  largestIntervalRow: number;
}

export class PlainRowParser {
  private readonly exports: CaptureRowsExports;
  private readonly memory: Uint8Array;
  private readonly current: Float64Array;
  private readonly voltage: Float64Array;
  private readonly temperature: Float64Array;
  private windowBytes: Uint8Array | null = null;
  private windowStart = 0;
  private windowEnd = 0;

  constructor() {
    const module = new WebAssembly.Module(Buffer.from(CAPTURE_ROWS_WASM_BASE64, "base64"));
    this.exports = new WebAssembly.Instance(module, {}).exports as unknown as CaptureRowsExports;
    const { memory } = this.exports;
    memory.grow(Math.ceil(MEMORY_BYTES / PAGE_BYTES) - memory.buffer.byteLength / PAGE_BYTES);
    this.memory = new Uint8Array(memory.buffer);
    new Float64Array(memory.buffer, POWERS_OF_TEN_AT, 23).set(Array.from({ length: 23 }, (_, k) => Number(`1e${k}`)));
    this.current = new Float64Array(memory.buffer, CURRENT_AT, CALL_ROWS);
    this.voltage = new Float64Array(memory.buffer, VOLTAGE_AT, CALL_ROWS);
    this.temperature = new Float64Array(memory.buffer, TEMPERATURE_AT, CALL_ROWS);
  }

  /** Sets the format for the reads that follow and forgets the window. */
  configure(format: PlainRowFormat): void {
    const { roles, scales, channels } = format;
    if (roles.length > PLAIN_ROW_MAX_COLUMNS) throw new RangeError(`plain rows have at most ${PLAIN_ROW_MAX_COLUMNS} columns`);
    this.memory.set(roles, ROLES_AT);
    this.exports.configure(
      roles.length,
      format.delimiter,
      format.commaIsDecimal ? 1 : 0,
      format.hasTime ? 1 : 0,
      scales.current,
      scales.voltage,
      scales.temperature,
      channels.current ? CURRENT_AT : 0,
      channels.voltage ? VOLTAGE_AT : 0,
      channels.temperature ? TEMPERATURE_AT : 0,
    );
    this.windowBytes = null;
  }

  /**
   * Reads plain rows of bytes[start, end) (whole lines) from `start`, at most `maxRows`; `first` says the row at
   * `start` is the reader's first, `lastTime` is the time of the row before it. The values wait in the module's
   * memory for copyRows.
   */
  read(bytes: Uint8Array, start: number, end: number, maxRows: number, first: boolean, lastTime: number): PlainRowsRead {
    if (bytes !== this.windowBytes || start < this.windowStart || start >= this.windowEnd) this.load(bytes, start, end);
    const exports = this.exports;
    const stop = exports.parseRows(INPUT_AT + start - this.windowStart, INPUT_AT + this.windowEnd - this.windowStart, Math.min(maxRows, CALL_ROWS), first ? 1 : 0, lastTime);
    return {
      next: stop - INPUT_AT + this.windowStart,
      rows: exports.rows.value as number,
      firstTime: exports.firstTime.value as number,
      lastTime: exports.lastTime.value as number,
      largestInterval: exports.largestInterval.value as number,
      largestIntervalRow: exports.largestIntervalRow.value as number,
    };
  }

  /** Copies the values of the last read's `rows` rows to the channels, from index `at`. */
  copyRows(rows: number, at: number, current: Float64Array | null, voltage: Float64Array | null, temperature: Float64Array | null): void {
    current?.set(this.current.subarray(0, rows), at);
    voltage?.set(this.voltage.subarray(0, rows), at);
    temperature?.set(this.temperature.subarray(0, rows), at);
  }

  /** Copies in the whole lines of bytes[start, end) that fit the window; none when the first line is longer. */
  private load(bytes: Uint8Array, start: number, end: number): void {
    let windowEnd = end;
    if (end - start > WINDOW_BYTES) windowEnd = Math.max(start, bytes.lastIndexOf(LF, start + WINDOW_BYTES - 1) + 1);
    this.memory.set(bytes.subarray(start, windowEnd), INPUT_AT);
    this.windowBytes = bytes;
    this.windowStart = start;
    this.windowEnd = windowEnd;
  }
}

let parser: PlainRowParser | null = null;

/** This thread's parser. */
export function plainRowParser(): PlainRowParser {
  parser ??= new PlainRowParser();
  return parser;
}
