// The header of a capture, read from its first bytes, for a form that maps
// columns before anything is analysed. It goes through the capture reader
// itself, so the names offered are exactly the names an analysis will match.

import { CaptureError, readCapture, type Capture, type HeaderEntry } from "./capture-csv";

export interface CaptureColumns {
  columns: string[];
  header: HeaderEntry[];
  firstDataLine: number;
  /** The columns the reader picks by name when told nothing; null where none is recognised. */
  detected: Capture["mapping"];
}

const MAX_COLUMNS = 64;

/**
 * `head` is the start of the file; unless `complete`, a line cut at its end is
 * dropped. The reader needs one numeric column mapped to get past the header,
 * so columns are tried in turn until one holds plain numbers (a timestamp
 * column does not); the first error is the one reported when none does.
 */
export async function readCaptureColumns(head: Uint8Array, { complete }: { complete: boolean }): Promise<CaptureColumns> {
  const lastNewline = head.lastIndexOf(10);
  const lines = complete || lastNewline < 0 ? head : head.subarray(0, lastNewline + 1);
  const noTime = { time: null, sampleIntervalSeconds: 1, voltage: null, temperature: null } as const;

  let read: Capture | null = null;
  let firstError: unknown = null;
  for (let column = 1; column <= MAX_COLUMNS && read === null; column++) {
    try {
      read = await readCapture(lines, { ...noTime, current: { column, scale: 1 } });
    } catch (error) {
      firstError ??= error;
      if (!(error instanceof CaptureError) || /^line \d+: there is no column/.test(error.message) || error.line === null) break;
    }
  }
  if (read === null) throw firstError;

  const mappingUnder = async (options: Parameters<typeof readCapture>[1]) => {
    try {
      return (await readCapture(lines, options)).mapping;
    } catch {
      return null;
    }
  };
  const heading = { columns: read.columns, header: read.header, firstDataLine: read.firstDataLine };
  const everything = await mappingUnder({});
  if (everything !== null) return { ...heading, detected: everything };
  // Channels by name with no time column assumed, and the time column by name beside any one column taken as the
  // channel: a capture whose channels are named CH1 and CH2 defeats the reader's own search, which wants both.
  const channels = await mappingUnder({ time: null, sampleIntervalSeconds: 1 });
  let time: string | null = null;
  for (let column = 1; column <= read.columns.length && time === null; column++) {
    time = (await mappingUnder({ current: { column, scale: 1 }, voltage: null, temperature: null }))?.time ?? null;
  }
  return {
    ...heading,
    detected: { time, current: channels?.current ?? null, voltage: channels?.voltage ?? null, temperature: channels?.temperature ?? null },
  };
}
