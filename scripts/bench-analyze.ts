// npm run bench:analyze: writes a 10-million-sample, two-channel capture at
// 50 kS/s, then, round after round, runs the analysis exactly as `analyze --json`
// does (in a fresh process, as the CLI starts one) and times a plain
// numpy.loadtxt + RMS of the same file for comparison; prints every round and
// the medians. Target: at least twice as fast as numpy and under 300 MB peak memory.
// `npm run bench:analyze -- --rounds N` changes the number of rounds (3).

import { spawnSync } from "node:child_process";
import { closeSync, mkdtempSync, openSync, rmSync, statSync, writeSync } from "node:fs";
import { loadavg, tmpdir } from "node:os";
import { join } from "node:path";
import { parseArgs } from "node:util";
import { analyzeCapture } from "../lib/bench/analysis";
import { startHelperThread } from "../lib/bench/helper-thread";

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

/** One analysis as the CLI runs it, measured from inside its own process. */
interface AnalysisTiming {
  stages: { stage: string; milliseconds: number; cpuMilliseconds: number }[];
  milliseconds: number;
  cpuMilliseconds: number;
  peakMegabytes: number;
  jsonBytes: number;
  rms: number;
  frequencyHz: number;
  duty: number;
}

const cpuMillisecondsSince = (before: NodeJS.CpuUsage) => {
  const used = process.cpuUsage(before);
  return (used.user + used.system) / 1000;
};

/** The child's side: analyzeCapture and JSON.stringify, as `analyze --json` does them, with each stage's wall and CPU time. */
async function measureAnalysis(path: string): Promise<AnalysisTiming> {
  const stages: AnalysisTiming["stages"] = [];
  const cpuBefore = process.cpuUsage();
  let stageCpu = process.cpuUsage();
  const started = performance.now();
  // Started inside the measured time, as the CLI starts it.
  const helper = startHelperThread();
  stages.push({ stage: "helper", milliseconds: performance.now() - started, cpuMilliseconds: cpuMillisecondsSince(stageCpu) });
  stageCpu = process.cpuUsage();
  const result = await analyzeCapture(
    { path },
    {},
    (stage, milliseconds) => {
      stages.push({ stage, milliseconds, cpuMilliseconds: cpuMillisecondsSince(stageCpu) });
      stageCpu = process.cpuUsage();
    },
    helper,
  );
  const jsonStarted = performance.now();
  const json = JSON.stringify(result);
  stages.push({ stage: "json", milliseconds: performance.now() - jsonStarted, cpuMilliseconds: cpuMillisecondsSince(stageCpu) });
  return {
    stages,
    milliseconds: performance.now() - started,
    cpuMilliseconds: cpuMillisecondsSince(cpuBefore),
    peakMegabytes: (process.resourceUsage().maxRSS * 1024) / 1e6,
    jsonBytes: json.length,
    rms: result.current.rms,
    frequencyHz: result.frequencyHz,
    duty: result.halfCycles.duty,
  };
}

/** A fresh process per round, started as `npm run analyze` starts the CLI (one bundle on plain Node), so each round is a cold start like the CLI's. */
function analysisRound(path: string): AnalysisTiming {
  const run = spawnSync(process.execPath, [join(import.meta.dirname, "run-bundled.mjs"), process.argv[1] as string, "--measure", path], { encoding: "utf8" });
  if (run.status !== 0) throw new Error(`analysis round failed: ${run.stderr || run.error?.message}`);
  return JSON.parse(run.stdout) as AnalysisTiming;
}

const seconds = (milliseconds: number) => `${(milliseconds / 1000).toFixed(3)} s`;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? (sorted[middle] as number) : ((sorted[middle - 1] as number) + (sorted[middle] as number)) / 2;
}

async function main(): Promise<void> {
  const { values } = parseArgs({ options: { measure: { type: "string" }, rounds: { type: "string", default: "3" } } });
  if (values.measure !== undefined) {
    process.stdout.write(JSON.stringify(await measureAnalysis(values.measure)));
    return;
  }
  const rounds = Number(values.rounds);
  if (!Number.isInteger(rounds) || rounds < 1) throw new Error(`--rounds must be a positive whole number, got ${values.rounds}`);

  const directory = mkdtempSync(join(tmpdir(), "benchplate-bench-"));
  const path = join(directory, "capture.csv");
  try {
    const started = performance.now();
    writeCapture(path);
    const megabytes = statSync(path).size / 1e6;
    console.log(`capture: ${SAMPLES} samples × 2 channels at ${SAMPLE_RATE_HZ} S/s, ${megabytes.toFixed(1)} MB, written in ${seconds(performance.now() - started)}`);

    // Rounds alternate the two so that both meet the same load on a shared machine.
    const analyses: AnalysisTiming[] = [];
    const baselines: NumpyTiming[] = [];
    for (let round = 1; round <= rounds; round++) {
      const analysis = analysisRound(path);
      const numpy = numpyBaseline(path);
      analyses.push(analysis);
      baselines.push(numpy);
      console.log(
        `round ${round} (load ${(loadavg()[0] as number).toFixed(1)}): analysis ${seconds(analysis.milliseconds)} wall, ${seconds(analysis.cpuMilliseconds)} CPU, ` +
          `peak ${analysis.peakMegabytes.toFixed(1)} MB; numpy ${numpy.seconds.toFixed(3)} s wall, ${numpy.cpuSeconds.toFixed(3)} s CPU; ` +
          `${((numpy.seconds * 1000) / analysis.milliseconds).toFixed(2)}× by wall, ${((numpy.cpuSeconds * 1000) / analysis.cpuMilliseconds).toFixed(2)}× by CPU`,
      );
    }

    const first = analyses[0] as AnalysisTiming;
    console.log(`stages, median of ${rounds} (wall / CPU):`);
    first.stages.forEach(({ stage }, k) => {
      const wall = median(analyses.map((analysis) => analysis.stages[k]?.milliseconds ?? 0));
      const cpu = median(analyses.map((analysis) => analysis.stages[k]?.cpuMilliseconds ?? 0));
      console.log(`  ${stage.padEnd(12)}${seconds(wall)} / ${seconds(cpu)}`);
    });
    const wall = median(analyses.map((analysis) => analysis.milliseconds));
    const cpu = median(analyses.map((analysis) => analysis.cpuMilliseconds));
    const numpyWall = median(baselines.map((numpy) => numpy.seconds));
    const numpyCpu = median(baselines.map((numpy) => numpy.cpuSeconds));
    console.log(`analysis total, median: ${seconds(wall)} wall, ${seconds(cpu)} CPU (${first.jsonBytes} bytes of JSON)`);
    console.log(`peak resident memory: ${Math.max(...analyses.map((analysis) => analysis.peakMegabytes)).toFixed(1)} MB, the largest of the rounds (target < 300 MB)`);
    console.log(`check: current RMS ${first.rms.toFixed(4)} A, frequency ${first.frequencyHz.toFixed(3)} Hz, duty ${first.duty.toFixed(3)}`);
    console.log(
      `numpy.loadtxt + RMS, median: ${numpyWall.toFixed(3)} s wall, ${numpyCpu.toFixed(3)} s CPU ` +
        `(current RMS ${(baselines[0] as NumpyTiming).rms.toFixed(4)} A over every sample)`,
    );
    // On a shared machine wall time swings with other load; CPU time is the steadier comparison, so both are shown,
    // and so is the median of each round's own ratio, whose two runs follow each other and so meet the same load.
    const roundRatios = analyses.map((analysis, k) => ((baselines[k] as NumpyTiming).seconds * 1000) / analysis.milliseconds);
    console.log(
      `speed, medians: ${((numpyWall * 1000) / wall).toFixed(2)}× numpy by wall time, ` +
        `${((numpyCpu * 1000) / cpu).toFixed(2)}× by CPU time; median of the rounds' own ratios ${median(roundRatios).toFixed(2)}× by wall time (target ≥ 2×)`,
    );
  } finally {
    rmSync(directory, { recursive: true, force: true });
  }
}

await main();
