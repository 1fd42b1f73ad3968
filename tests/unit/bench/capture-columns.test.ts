import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { readCaptureColumns } from "@/lib/bench/capture-columns";
import { CaptureError } from "@/lib/bench/capture-csv";

const fixture = (name: string) => readFileSync(join(import.meta.dirname, "../../fixtures/captures", name));

describe("readCaptureColumns", () => {
  it("names the columns of a scope export whose channels are called CH1 and CH2, from its first bytes", async () => {
    const heading = await readCaptureColumns(fixture("orrery-orm42-hot-air.csv").subarray(0, 2000), { complete: false });
    expect(heading.columns).toEqual(["TIME", "CH1", "CH2"]);
    expect(heading.firstDataLine).toBe(9);
    expect(heading.header.find((entry) => entry.key === "Sample Interval")?.value).toBe("2.0000E-04");
    expect(heading.detected).toEqual({ time: "TIME", current: null, voltage: null, temperature: null });
  });

  it("reads past a row of units and recognises channels by name", async () => {
    const heading = await readCaptureColumns(fixture("quillon-q3-soldering-station.tsv").subarray(0, 3000), { complete: false });
    expect(heading.columns).toEqual(["current", "voltage"]);
    expect(heading.detected).toMatchObject({ time: null, current: "current", voltage: "voltage" });
  });

  it("skips a timestamp column to get past the header, and takes a lone channel as the current", async () => {
    const heading = await readCaptureColumns(fixture("tallowmere-tl8-heat-gun.csv").subarray(0, 3000), { complete: false });
    expect(heading.columns).toEqual(["Timestamp", "Clamp A (V)"]);
    expect(heading.detected).toMatchObject({ time: "Timestamp", current: "Clamp A (V)" });
  });

  it("reports why a file is not a capture", async () => {
    await expect(readCaptureColumns(Buffer.from(""), { complete: true })).rejects.toBeInstanceOf(CaptureError);
    await expect(readCaptureColumns(Buffer.from("just words\nand more words\n"), { complete: true })).rejects.toThrow(/header without rows/);
  });
});
