// npm run bench:analyze: writes a 10-million-sample, two-channel capture at
// 50 kS/s, runs the analysis exactly as `analyze --json` does, and times a
// plain numpy.loadtxt + RMS of the same file for comparison.
// Target: at least twice as fast as numpy and under 300 MB peak memory.

import { spawnSync } from "node:child_process";
import { closeSync, mkdtempSync, openSync, rmSync, statSync, writeSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { analyzeCapture } from "../lib/bench/analysis";

const SAMPLES = 10_000_000;
const SAMPLE_RATE_HZ = 50_000;
const HEADER_LINES = ["# Orrery Metrology ORM-42 two-channel capture (synthetic benchmark)", "Sample rate,50000 S/s", "time,current,voltage"];

/**
 * A 1000 W, 230 V heater burst-fired 6 cycles in 10 at 49.95 Hz, with a little
 * noise. Numbers are formatted by hand into the write buffer: Number#toFixed
 * on 30 million values takes longer than the analysis being measured, and its
 * garbage would inflate the peak memory the benchmark reports.
 */
function writeCapture(path: string): void {
  const file = openSync(path, "w");
  const buffer = Buffer.allocUnsafe(1 << 20);
  let at = buffer.write(`${HEADER_LINES.join("\n")}\n`, 0, "latin1");
  const scratch = new Uint8Array(24);
  const writeFixed = (scaled: number, decimals: number) => {
    let value = Math.round(scaled);
    if (value < 0) {
      buffer[at++] = 45;
      value = -value;
    }
    let count = 0;
    do {
      scratch[count++] = 48 + (value % 10);
      value = Math.floor(value / 10);
    } while (value > 0 || count <= decimals);
    for (let digit = count - 1; digit >= 0; digit--) {
      buffer[at++] = scratch[digit] as number;
      if (digit === decimals && decimals > 0) buffer[at++] = 46;
    }
  };
  const frequencyHz = 49.95;
  const peakVolts = 230 * Math.SQRT2;
  const ohms = (230 * 230) / 1000;
  let seed = 12345;
  const noise = () => {
    seed = (seed * 1103515245 + 12345) % 2147483648;
    return seed / 2147483648 - 0.5;
  };
  for (let k = 0; k < SAMPLES; k++) {
    if (at > buffer.length - 64) {
      writeSync(file, buffer, 0, at);
      at = 0;
    }
    const cycles = (frequencyHz * k) / SAMPLE_RATE_HZ;
    const volts = peakVolts * Math.sin(2 * Math.PI * cycles) + 0.2 * noise();
    const conducting = Math.floor(cycles) % 10 < 6;
    const amps = (conducting ? volts / ohms : 0) + 0.004 * noise();
    writeFixed(k * 20, 6);
    buffer[at++] = 44;
    writeFixed(amps * 1e4, 4);
    buffer[at++] = 44;
    writeFixed(volts * 100, 2);
    buffer[at++] = 10;
  }
  writeSync(file, buffer, 0, at);
  closeSync(file);
}

const NUMPY_BASELINE = `
import sys, time, json
import numpy as np
started, cpu_started = time.perf_counter(), time.process_time()
data = np.loadtxt(sys.argv[1], delimiter=",", skiprows=int(sys.argv[2]))
rms = float(np.sqrt(np.mean(data[:, 1] ** 2)))
print(json.dumps({"seconds": time.perf_counter() - started, "cpuSeconds": time.process_time() - cpu_started, "rms": rms}))
`;

interface NumpyTiming {
  seconds: number;
  cpuSeconds: number;
  rms: number;
}

function numpyBaseline(path: string): NumpyTiming {
  // OPENBLAS_CORETYPE and OPENBLAS_L2_SIZE slow a current numpy on this machine; unset for this command only.
  const env = { ...process.env };
  delete env.OPENBLAS_CORETYPE;
  delete env.OPENBLAS_L2_SIZE;
  const run = spawnSync("python3", ["-c", NUMPY_BASELINE, path, String(HEADER_LINES.length)], { env, encoding: "utf8" });
  if (run.status !== 0) throw new Error(`numpy baseline failed: ${run.stderr || run.error?.message}`);
  return JSON.parse(run.stdout) as NumpyTiming;
}

const seconds = (milliseconds: number) => `${(milliseconds / 1000).toFixed(3)} s`;

async function main(): Promise<void> {
  const directory = mkdtempSync(join(tmpdir(), "benchplate-bench-"));
  const path = join(directory, "capture.csv");
  try {
    let started = performance.now();
    writeCapture(path);
    const megabytes = statSync(path).size / 1e6;
    console.log(`capture: ${SAMPLES} samples × 2 channels at ${SAMPLE_RATE_HZ} S/s, ${megabytes.toFixed(1)} MB, written in ${seconds(performance.now() - started)}`);

    const stages: [string, number][] = [];
    const cpuBefore = process.cpuUsage();
    started = performance.now();
    const result = await analyzeCapture({ path }, {}, (stage, milliseconds) => stages.push([stage, milliseconds]));
    const stageStart = performance.now();
    const json = JSON.stringify(result);
    stages.push(["json", performance.now() - stageStart]);
    const total = performance.now() - started;
    const cpu = process.cpuUsage(cpuBefore);
    const peakMegabytes = (process.resourceUsage().maxRSS * 1024) / 1e6;

    for (const [stage, milliseconds] of stages) console.log(`  ${stage.padEnd(12)}${seconds(milliseconds)}`);
    console.log(`analysis total: ${seconds(total)} wall, ${seconds((cpu.user + cpu.system) / 1000)} CPU (${json.length} bytes of JSON)`);
    console.log(`peak resident memory: ${peakMegabytes.toFixed(1)} MB (target < 300 MB)`);
    console.log(`check: current RMS ${result.current.rms.toFixed(4)} A, frequency ${result.frequencyHz.toFixed(3)} Hz, duty ${result.halfCycles.duty.toFixed(3)}`);

    const numpy = numpyBaseline(path);
    console.log(
      `numpy.loadtxt + RMS: ${numpy.seconds.toFixed(3)} s wall, ${numpy.cpuSeconds.toFixed(3)} s CPU ` +
        `(current RMS ${numpy.rms.toFixed(4)} A over every sample)`,
    );
    const cpuSeconds = (cpu.user + cpu.system) / 1e6;
    // On a shared machine wall time swings with other load; CPU time is the steadier comparison, so both are shown.
    console.log(
      `speed: ${(numpy.seconds / (total / 1000)).toFixed(2)}× numpy by wall time, ` +
        `${(numpy.cpuSeconds / cpuSeconds).toFixed(2)}× by CPU time (target ≥ 2×)`,
    );
  } finally {
    rmSync(directory, { recursive: true, force: true });
  }
}

await main();
