/**
 * Lanewright benchmark runner (`npm run bench` = `tsx bench/run.ts`).
 *
 * Discovers every `bench/*.bench.ts` module, each exporting
 * `benches: { name: string; target?: string; run: () => void; iterations?: number }[]`, times each
 * bench (warm-up, then `iterations` samples), prints a table of median and p95 milliseconds per
 * call and writes `bench/results.json` ({ machine, date, results: [{ name, medianMs, p95Ms,
 * target }] }).
 *
 * Timing: a sample runs the bench `batch` times in a row and records the mean per call, where
 * `batch` is chosen during warm-up so a sample lasts about 0.2 ms — calls far shorter than the
 * timer's resolution are still measured. A target of the form "< N ms" (optionally followed by
 * words such as "median") is checked against the median and reported as ok / MISSED. A bench that
 * throws is reported as ERROR (figures null in results.json) and the run goes on; the exit status
 * is then 1.
 *
 * Usage: `npm run bench [-- FILTER] [-- --strict]`: FILTER keeps benches whose file or name
 * contains it; --strict exits with status 1 when a target is missed.
 */
import { readdirSync, writeFileSync } from 'node:fs';
import { cpus, arch, platform, release, totalmem } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { performance } from 'node:perf_hooks';

/** One benchmark: a named, repeatable piece of work. */
export interface Bench {
  name: string;
  /** e.g. '< 5 ms median'. */
  target?: string;
  run: () => void;
  /** Number of timed samples; default 200. */
  iterations?: number;
}

/** The figures of one bench, as written to results.json. */
export interface BenchResult {
  name: string;
  medianMs: number;
  p95Ms: number;
  target: string | null;
  samples: number;
  batch: number;
  file: string;
  /** Set when the bench threw; its figures are then NaN. */
  error?: string;
}

const DEFAULT_ITERATIONS = 200;
const SAMPLE_MS = 0.2;
const WARMUP_MS = 150;

/** Nearest-rank quantile of sorted values, p in (0, 1]. */
function quantileSorted(sorted: number[], p: number): number {
  const rank = Math.max(1, Math.ceil(p * sorted.length));
  return sorted[rank - 1];
}

/** Times one bench. */
export function measure(bench: Bench, file: string): BenchResult {
  // Warm-up: let the JIT settle and learn how many calls fit in one sample.
  let calls = 0;
  const start = performance.now();
  while (performance.now() - start < WARMUP_MS || calls < 5) {
    bench.run();
    calls++;
  }
  const perCallMs = (performance.now() - start) / calls;
  const batch = Math.max(1, Math.round(SAMPLE_MS / perCallMs));
  const iterations = bench.iterations ?? DEFAULT_ITERATIONS;
  const samples: number[] = [];
  for (let i = 0; i < iterations; i++) {
    const t0 = performance.now();
    for (let k = 0; k < batch; k++) bench.run();
    samples.push((performance.now() - t0) / batch);
  }
  samples.sort((a, b) => a - b);
  return {
    name: bench.name,
    medianMs: quantileSorted(samples, 0.5),
    p95Ms: quantileSorted(samples, 0.95),
    target: bench.target ?? null,
    samples: iterations,
    batch,
    file,
  };
}

/** 'ok', 'MISSED' or '' for a "< N ms" target checked against the median. */
export function targetStatus(r: BenchResult): string {
  if (r.error) return 'ERROR';
  const m = r.target?.match(/^\s*<\s*([\d.]+)\s*ms/);
  if (!m) return '';
  return r.medianMs < Number(m[1]) ? 'ok' : 'MISSED';
}

function fmt(ms: number): string {
  if (Number.isNaN(ms)) return '—';
  return ms >= 1 ? ms.toFixed(2) : ms >= 0.01 ? ms.toFixed(4) : ms.toExponential(2);
}

function table(rows: string[][]): string {
  const widths = rows[0].map((_, c) => Math.max(...rows.map((r) => r[c].length)));
  return rows.map((r) => r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]) : cell.padStart(widths[c]))).join('  ')).join('\n');
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const strict = args.includes('--strict');
  const filter = args.find((a) => !a.startsWith('--'));
  const here = dirname(fileURLToPath(import.meta.url));
  const files = readdirSync(here)
    .filter((f) => f.endsWith('.bench.ts'))
    .sort();

  const results: BenchResult[] = [];
  for (const file of files) {
    const mod: { benches?: unknown } = await import(pathToFileURL(join(here, file)).href);
    if (!Array.isArray(mod.benches)) {
      console.warn(`bench: ${file} exports no "benches" array; skipped`);
      continue;
    }
    for (const bench of mod.benches as Bench[]) {
      if (filter && !file.includes(filter) && !bench.name.includes(filter)) continue;
      try {
        results.push(measure(bench, file));
      } catch (err: unknown) {
        const error = err instanceof Error ? `${err.name}: ${err.message}` : String(err);
        console.error(`bench: "${bench.name}" (${file}) threw ${error}`);
        results.push({
          name: bench.name,
          medianMs: Number.NaN,
          p95Ms: Number.NaN,
          target: bench.target ?? null,
          samples: 0,
          batch: 0,
          file,
          error,
        });
      }
    }
  }

  const rows = [['bench', 'median ms', 'p95 ms', 'batch', 'target', '']];
  for (const r of results) rows.push([r.name, fmt(r.medianMs), fmt(r.p95Ms), String(r.batch), r.target ?? '', targetStatus(r)]);
  console.log(table(rows));

  const cpu = cpus();
  const out = {
    machine: {
      platform: platform(),
      release: release(),
      arch: arch(),
      cpu: cpu[0]?.model ?? 'unknown',
      cpuCount: cpu.length,
      memoryGb: Math.round((totalmem() / 2 ** 30) * 10) / 10,
      node: process.version,
    },
    date: new Date().toISOString(),
    results: results.map(({ name, medianMs, p95Ms, target, samples, batch, file, error }) => ({
      name,
      medianMs: Number.isNaN(medianMs) ? null : medianMs,
      p95Ms: Number.isNaN(p95Ms) ? null : p95Ms,
      target,
      samples,
      batch,
      file,
      ...(error ? { error } : {}),
    })),
  };
  writeFileSync(join(here, 'results.json'), JSON.stringify(out, null, 2) + '\n');
  console.log(`\nwrote bench/results.json (${results.length} results)`);

  if (results.some((r) => r.error)) process.exitCode = 1;
  if (strict && results.some((r) => targetStatus(r) === 'MISSED')) process.exitCode = 1;
}

// Run only when executed directly (so bench files may import the Bench type from here).
if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  main().catch((err: unknown) => {
    console.error(err);
    process.exit(1);
  });
}
