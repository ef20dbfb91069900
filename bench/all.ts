/**
 * `npm run bench`: every bench in turn — engine (run.ts), accuracy, HTTP, statistics, reliability, engine load, league night,
 * Lighthouse (accessibility, best practices, installability) — each to the end even when an earlier one misses a target or fails, so one run always writes every section of
 * bench/results.json. Prints which parts missed; exits 1 if any did. Arguments go to run.ts (its FILTER, --strict).
 */
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const here = path.dirname(fileURLToPath(import.meta.url));
const root = path.resolve(here, '..');
const PARTS = ['run.ts', 'accuracy.ts', 'http.ts', 'stats.ts', 'reliability.ts', 'engineLoad.ts', 'leagueNight.ts', 'lighthouse.ts'];

const missed: string[] = [];
for (const part of PARTS) {
  console.log(`\n=== bench/${part} ===`);
  const r = spawnSync(
    path.join(root, 'node_modules', '.bin', 'tsx'),
    [path.join('bench', part), ...(part === 'run.ts' ? process.argv.slice(2) : [])],
    { cwd: root, stdio: 'inherit' },
  );
  if (r.status !== 0) missed.push(`bench/${part} (exit ${r.status ?? r.signal})`);
}
console.log(missed.length ? `\nmissed a target or failed: ${missed.join(', ')}` : '\nevery bench ran and met its targets');
process.exitCode = missed.length ? 1 : 0;
