import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { CaptureError, readCapture, readCaptureFile, type CaptureReadOptions } from "@/lib/bench/capture-csv";

const fixtures = join(import.meta.dirname, "../../fixtures/captures");
const mains = { frequencyHz: 50, minWholeCycles: 10 };

/** Rows of "t,current,voltage" at `rate` S/s: a 50 Hz sine pair, long enough for the mains checks. */
function rows(count: number, rate = 5000): string[] {
  return Array.from({ length: count }, (_, k) => {
    const angle = (2 * Math.PI * 50 * k) / rate;
    return `${k / rate},${(5 * Math.sin(angle)).toFixed(4)},${(325 * Math.sin(angle)).toFixed(2)}`;
  });
}

async function rejection(text: string | Uint8Array, options: CaptureReadOptions = {}): Promise<CaptureError> {
  try {
    await readCapture(text, options);
  } catch (error) {
    expect(error).toBeInstanceOf(CaptureError);
    return error as CaptureError;
  }
  throw new Error("the capture was accepted");
}

describe("reading captures", () => {
  it("reads a scope export: BOM, CRLF, key,value header lines, scientific notation, a clamp scaled to amperes", async () => {
    const capture = await readCaptureFile(join(fixtures, "orrery-orm42-hot-air.csv"), {
      current: { column: "CH1", scale: 10 },
      voltage: { column: 3, scale: 1 },
      mains,
    });
    expect(capture.sampleCount).toBe(1250);
    expect(capture.sampleRateHz).toBeCloseTo(5000, 6);
    expect(capture.timeSource).toBe("seconds column");
    expect(capture.mapping).toEqual({ time: "TIME", current: "CH1", voltage: "CH2", temperature: null });
    expect(capture.header).toContainEqual({ key: "Model", value: "ORM-42", line: 2 });
    expect(capture.header).toContainEqual({ key: "Sample Interval", value: "2.0000E-04", line: 5 });
    expect(capture.firstDataLine).toBe(9);
    // Row 2 of the data: CH1 2.3119E-02 V through a 100 mV/A clamp.
    expect(capture.current?.[1]).toBeCloseTo(0.23119, 12);
    expect(capture.voltage?.[1]).toBeCloseTo(20.383, 12);
  });

  it("reads a logger export: semicolons, decimal commas, ISO 8601 timestamps, key: value header lines", async () => {
    const capture = await readCaptureFile(join(fixtures, "tallowmere-tl8-heat-gun.csv"), {
      current: { column: "clamp a", scale: 10 },
      mains,
    });
    expect(capture.delimiter).toBe(";");
    expect(capture.timeSource).toBe("timestamp column");
    expect(capture.sampleRateHz).toBeCloseTo(5000, 6);
    expect(capture.voltage).toBeNull();
    expect(capture.header).toContainEqual({ key: "Serial", value: "TL8-000417", line: 2 });
    expect(capture.current?.[1]).toBeCloseTo(0.309, 12);
  });

  it("reads a tab-separated dump with decimal commas, a units row and no time column, given the sample interval", async () => {
    const capture = await readCaptureFile(join(fixtures, "quillon-q3-soldering-station.tsv"), { sampleIntervalSeconds: 0.0002, mains });
    expect(capture.delimiter).toBe("\t");
    expect(capture.columns).toEqual(["current", "voltage"]);
    expect(capture.timeSource).toBe("sample interval");
    expect(capture.sampleRateHz).toBe(5000);
    expect(capture.voltage?.[1]).toBeCloseTo(20.42, 12);
  });

  it("gives the same samples whatever the chunk boundaries", async () => {
    const text = ["# Kestrelline KL-2 scope", "Vertical: 1 V/div", "time,current,voltage", ...rows(1200)].join("\r\n") + "\r\n";
    const whole = await readCapture(text, { mains });
    const bytes = Buffer.from(text);
    for (const size of [1, 2, 3, 7, 64, 4096]) {
      const chunks = async function* () {
        for (let at = 0; at < bytes.length; at += size) yield bytes.subarray(at, at + size);
      };
      const chunked = await readCapture(chunks(), { mains });
      expect(chunked.current).toEqual(whole.current);
      expect(chunked.voltage).toEqual(whole.voltage);
    }
  });

  it("parses numbers exactly: signs, exponents, quotes, spaces, long mantissas", async () => {
    const text = [
      "time,current",
      '0," 1.5 "',
      "1e-4,-2.5E+1",
      "2e-4,+.25",
      "3e-4,3.14159265358979323846",
      "0.0004,1234567890123456789",
      "0.0005,7e-30",
    ].join("\n");
    const capture = await readCapture(text);
    expect(Array.from(capture.current ?? [])).toEqual([1.5, -25, 0.25, 3.141592653589793, 1234567890123456800, 7e-30]);
  });

  it("reads every length of digit run before and after the decimal mark as JavaScript's own parser does", async () => {
    // Runs of 0 to 17 digits on either side of the mark, so across the 15 digits where the exact slow path takes
    // over, with points and with commas as the mark, and in the last line of a buffer with nothing after it.
    let seed = 7;
    const digit = () => {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      return String(seed % 10);
    };
    const run = (length: number) => Array.from({ length }, digit).join("");
    const texts: string[] = [];
    for (let whole = 0; whole <= 17; whole++) {
      for (let fraction = 0; fraction <= 17; fraction++) {
        if (whole + fraction === 0) continue;
        const sign = (whole + fraction) % 3 === 0 ? "-" : "";
        texts.push(`${sign}${run(whole)}${fraction > 0 ? `.${run(fraction)}` : ""}`);
      }
    }
    const expected = texts.map((text) => Number(text));
    // An array of its own, so nothing follows the last line in its buffer.
    const points = await readCapture(new TextEncoder().encode(["time,current", ...texts.map((text, k) => `${k},${text}`)].join("\n")));
    expect(Array.from(points.current ?? [])).toEqual(expected);
    const commas = await readCapture(["time;current", ...texts.map((text, k) => `${k};${text.replace(".", ",")}`)].join("\r\n"));
    expect(Array.from(commas.current ?? [])).toEqual(expected);
  });

  it("gives a number the same value whether its row is plain or needs the full reading", async () => {
    // Plain rows go to the WebAssembly reader; blanks, quotes, a plus, an unmapped column or many digits send a row to the full one.
    const numbers = ["1.5", "-0.0012", "325.27", "2.5e-3", "-7E2", "0.1", "123456.789012345", "9007199254740993", "1e30"];
    const forms = [(n: string) => n, (n: string) => ` ${n} `, (n: string) => `"${n}"`, (n: string) => (n.startsWith("-") ? n : `+${n}`)];
    const read = async (form: (n: string) => string, extra: string) =>
      Array.from((await readCapture(["time,current" + (extra ? ",note" : ""), ...numbers.map((n, k) => `${k},${form(n)}${extra}`)].join("\n"), { current: { column: "current", scale: 1 } })).current ?? []);
    const expected = numbers.map(Number);
    for (const form of forms) {
      expect(await read(form, "")).toEqual(expected);
      expect(await read(form, ",7")).toEqual(expected);
    }
  });

  it("skips blank, blank-looking and comment lines among the rows", async () => {
    const capture = await readCapture("time,current\n0,1\n\n   \t\r\n# marker: load step\n0.001,2\n");
    expect(Array.from(capture.current ?? [])).toEqual([1, 2]);
  });

  it("maps the only channel of a two-column capture to current and finds columns by name with units", async () => {
    const capture = await readCapture("Time (s),Probe\n0,1\n0.001,2\n");
    expect(capture.mapping.current).toBe("Probe");
    const named = await readCapture("Time [s],Current (A),Voltage (V)\n0,1,2\n0.001,3,4\n");
    expect(named.mapping).toMatchObject({ time: "Time [s]", current: "Current (A)", voltage: "Voltage (V)" });
  });

  it("applies a scale given without a column to the column found by name", async () => {
    const capture = await readCapture("time,Current (V)\n0,0.25\n0.001,0.5\n", { current: { scale: 10 } });
    expect(Array.from(capture.current ?? [])).toEqual([2.5, 5]);
  });

  it("accepts timestamps with a zone offset and keeps sub-millisecond steps", async () => {
    const capture = await readCapture(
      "timestamp,current\n2025-01-01T00:59:59.9999+01:00,1\n2025-01-01T00:00:00.0000Z,2\n2025-01-01T00:00:00.0001Z,3\n",
    );
    expect(capture.sampleRateHz).toBeCloseTo(10_000, 6);
  });
});

describe("rejected captures name the problem and the line", () => {
  const valid = ["time,current,voltage", ...rows(1200)];

  it("empty file", async () => {
    for (const text of ["", "\n\n  \r\n", "\ufeff"]) {
      const error = await rejection(text);
      expect(error.problem).toBe("empty file: there is nothing to read");
      expect(error.line).toBeNull();
    }
  });

  it("binary data: NUL bytes", async () => {
    const error = await rejection(Buffer.concat([Buffer.from("time,current\n0,1\n"), Buffer.from([0x50, 0x4b, 0x00, 0x03])]));
    expect(error.problem).toBe("binary data: the file holds NUL bytes, so it is not a CSV text export");
    expect(error.line).toBe(3);
  });

  it("binary data: UTF-16 text", async () => {
    const error = await rejection(Buffer.from("\ufefftime,current\n", "utf16le"));
    expect(error.problem).toMatch(/^binary data: the file is UTF-16 text/);
    expect(error.line).toBe(1);
  });

  it("binary data: control characters in a header line", async () => {
    const error = await rejection("model\x07x\ntime,current\n0,1\n");
    expect(error.problem).toBe("binary data: control characters in a text line");
    expect(error.line).toBe(1);
  });

  it("header without rows", async () => {
    const error = await rejection("# Kestrelline KL-2 scope\nSample rate: 5 kS/s\ntime,current\n\n");
    expect(error.problem).toMatch(/^header without rows: no row of numbers follows the header/);
    expect(error.line).toBe(3);
  });

  it("ragged rows: a short row", async () => {
    const lines = [...valid];
    lines[500] = "0.0999,1.5";
    const error = await rejection(lines.join("\n"));
    expect(error.problem).toBe("ragged rows: 2 values where the column names give 3");
    expect(error.line).toBe(501);
  });

  it("ragged rows: the column names and the first row disagree", async () => {
    const error = await rejection("time,current\n0,1,2\n");
    expect(error.problem).toBe("ragged rows: 3 values on this line but 2 column names on line 1");
    expect(error.line).toBe(2);
  });

  it("text in numbers", async () => {
    const lines = [...valid];
    lines[700] = "0.1399,OVERLOAD,12";
    const error = await rejection(lines.join("\n"));
    expect(error.problem).toBe('text in numbers: "OVERLOAD" in column 2 ("current") is not a number');
    expect(error.line).toBe(701);
  });

  it("text in numbers: an empty value", async () => {
    const lines = [...valid];
    lines[3] = "0.0004,,12";
    const error = await rejection(lines.join("\n"));
    expect(error.problem).toBe('text in numbers: an empty value in column 2 ("current")');
    expect(error.line).toBe(4);
  });

  it("text in numbers: the first data row", async () => {
    const error = await rejection("time,current\n0,abc\n1e-4,2\n");
    expect(error.problem).toBe('text in numbers: "abc" in column 2 ("current") is not a number');
    expect(error.line).toBe(2);
  });

  it("NaN or infinity in numbers", async () => {
    for (const [token, shown] of [
      ["NaN", "NaN"],
      ["-inf", "-inf"],
      ["Infinity", "Infinity"],
      ["1e400", "1e400"],
    ]) {
      const lines = [...valid];
      lines[9] = `0.0018,${token},1`;
      const error = await rejection(lines.join("\n"));
      expect(error.problem).toBe(`NaN or infinity in numbers: "${shown}" in column 2 ("current"); only finite numbers can be analysed`);
      expect(error.line).toBe(10);
    }
  });

  it("time not increasing", async () => {
    const lines = [...valid];
    lines[300] = lines[299] as string;
    const error = await rejection(lines.join("\n"));
    expect(error.problem).toMatch(/^time not increasing: 0\.0596 s follows 0\.0596 s on the row before/);
    expect(error.line).toBe(301);
  });

  it("gap in time", async () => {
    const lines = [...valid.slice(0, 400), ...valid.slice(403)];
    const error = await rejection(lines.join("\n"));
    expect(error.problem).toBe("gap in time: 800 µs since the previous row where samples are 200.5 µs apart on average (samples missing?)");
    expect(error.line).toBe(401);
  });

  it("sample rate too low for the mains frequency", async () => {
    const error = await rejection(["time,current", ...rows(100, 1000).map((row) => row.split(",").slice(0, 2).join(","))].join("\n"), {
      mains,
    });
    expect(error.problem).toBe(
      "sample rate too low: 1000 S/s for 50 Hz mains; harmonics to the 40th need more than 4000 S/s (80 samples a cycle)",
    );
    expect(error.line).toBeNull();
  });

  it("fewer whole cycles than the analysis needs", async () => {
    const error = await rejection(valid.slice(0, 901).join("\n"), { mains });
    expect(error.problem).toBe("the capture holds 9 whole cycles of 50 Hz mains (180 ms); the analysis needs at least 10");
    expect(error.line).toBeNull();
  });

  it("a column that is not there", async () => {
    const error = await rejection(valid.join("\n"), { current: { column: "CH4", scale: 1 } });
    expect(error.problem).toBe('no column named "CH4": the columns are 1 "time", 2 "current", 3 "voltage"');
    expect(error.line).toBe(1);
    const byNumber = await rejection(valid.join("\n"), { current: { column: 5, scale: 1 } });
    expect(byNumber.problem).toBe('there is no column 5: the capture has 3 (1 "time", 2 "current", 3 "voltage")');
  });

  it("one column mapped twice", async () => {
    const error = await rejection(valid.join("\n"), { current: { column: 2, scale: 1 }, voltage: { column: "current", scale: 1 } });
    expect(error.problem).toBe('column 2 ("current") is mapped to both current and voltage');
    expect(error.line).toBe(1);
  });

  it("no time column and no sample interval", async () => {
    const error = await rejection("current,voltage\n1,2\n3,4\n");
    expect(error.problem).toBe("no time column found: name it, or give the sample interval in seconds");
    expect(error.line).toBe(1);
  });

  it("no channel recognised", async () => {
    const error = await rejection("time,CH1,CH2\n0,1,2\n0.001,3,4\n");
    expect(error.problem).toMatch(/^no current, voltage or temperature column recognised among "time", "CH1", "CH2"/);
    expect(error.line).toBe(1);
  });

  it("no column for a quantity the caller requires", async () => {
    const error = await rejection("time,voltage\n0,1\n0.001,2\n", { required: ["current"] });
    expect(error.problem).toBe('no current column recognised among "time", "voltage": name it (by column name or 1-based number)');
    expect(error.line).toBe(1);
  });

  it("a single row cannot give a sample rate", async () => {
    const error = await rejection("time,current\n0,1\n");
    expect(error.problem).toBe("only one row of numbers: the sample rate needs at least two");
    expect(error.line).toBe(2);
  });

  it("binary data: a line longer than 1 MiB", async () => {
    const error = await rejection(`time,current\n0,1\n${"9".repeat(1.5 * 2 ** 20)}`);
    expect(error.problem).toBe("binary data: a line longer than 1 MiB, so the file is not a CSV capture");
    expect(error.line).toBe(3);
  });

  it("binary data: a carriage return inside a row, or control bytes in a number", async () => {
    const carriage = await rejection("time,current\n0,1\n0.001,2\r3\n");
    expect(carriage.problem).toBe("binary data: a carriage return inside a row");
    expect(carriage.line).toBe(3);
    const control = await rejection("time,current\n0,1\n0.001,2\x01\n");
    expect(control.problem).toBe('binary data in column 2 ("current")');
    expect(control.line).toBe(3);
  });

  it("header without rows: nothing numeric within the first 10 000 lines", async () => {
    const error = await rejection(Array.from({ length: 10_001 }, (_, k) => `setting ${k}: on`).join("\n"));
    expect(error.problem).toBe("header without rows: no row of numbers in the first 10000 lines");
    expect(error.line).toBe(10_001);
  });

  it("text in numbers: a timestamp column with something else further down", async () => {
    const error = await rejection("timestamp,current\n2025-01-01T00:00:00.000Z,1\n12:00:01,2\n");
    expect(error.problem).toBe('text in numbers: "12:00:01" in column 1 ("timestamp") is not an ISO 8601 timestamp like the first row\'s');
    expect(error.line).toBe(3);
  });

  it("a time column and a sample interval both given, a bad interval, a bad scale", async () => {
    const both = await rejection("time,current\n0,1\n0.001,2\n", { time: "time", sampleIntervalSeconds: 0.001 });
    expect(both.problem).toBe("give either a time column or a sample interval, not both");
    expect(both.line).toBeNull();
    const interval = await rejection("current\n1\n2\n", { sampleIntervalSeconds: -1 });
    expect(interval.problem).toBe("the sample interval must be a positive number of seconds, got -1");
    expect(interval.line).toBeNull();
    const scale = await rejection("time,current\n0,1\n0.001,2\n", { current: { scale: 0 } });
    expect(scale.problem).toBe("the current scale must be a finite, non-zero number, got 0");
    expect(scale.line).toBeNull();
  });

  it("a missing file", async () => {
    await expect(readCaptureFile(join(fixtures, "no-such-capture.csv"))).rejects.toMatchObject({
      name: "CaptureError",
      line: null,
      message: expect.stringMatching(/^no such file: .*no-such-capture\.csv$/),
    });
  });
});
