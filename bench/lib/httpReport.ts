/** The figures of bench/http.ts: each with its target and floor, printed and written to bench/results.json under "http". */
import os from 'node:os';
import { writeResults } from './benchServer';
import type { Loaded } from './httpLoad';

/** What bench/http.ts measured. */
export interface HttpMeasured {
  matchups: Loaded;
  cold: Loaded;
  answerKb: number;
  answerJsonKb: number;
  floor: { rps: number; p95: number };
  floorBig: { rps: number; p95: number };
  list: Loaded;
  listBig: Loaded;
  listBalls: number;
  bigBalls: number;
  rssMb: number;
  jsKb: number;
}

/** Prints the figures beside their targets and writes them to bench/results.json. */
export function reportHttp(m: HttpMeasured): void {
  const { matchups, cold, answerKb, answerJsonKb, floor, floorBig, list, listBig, rssMb, jsKb } = m;
  const errors = [matchups, list, listBig, cold].reduce((n, r) => n + r.non2xx + r.errors, 0);
  const ratio = (x: number, f: number) => Math.round((x / f) * 1000) / 1000;
  const http = [
    {
      name: 'POST /api/matchups (15 balls, 10 concurrent) p95, repeated input',
      value: matchups.p95,
      unit: 'ms',
      target: '≤ 300 ms',
      floor: floor.p95,
      ratio: null,
      ok: matchups.p95 <= 300,
    },
    {
      name: 'POST /api/matchups (15 balls, 10 concurrent) p95, cold (every input new)',
      value: cold.p95,
      unit: 'ms',
      target: '≤ 150 ms',
      floor: floor.p95,
      ratio: null,
      ok: cold.p95 <= 150,
    },
    {
      name: 'POST /api/matchups cold median latency',
      value: cold.latency.p50,
      unit: 'ms',
      target: null,
      floor: null,
      ratio: null,
      ok: null,
    },
    {
      name: 'POST /api/matchups cold requests/s',
      value: cold.requests.average,
      unit: 'req/s',
      target: null,
      floor: null,
      ratio: null,
      ok: null,
    },
    {
      name: 'POST /api/matchups answer (15 balls), gzip on the wire',
      value: answerKb,
      unit: 'kB',
      target: '≤ 40 kB',
      floor: null,
      ratio: null,
      ok: answerKb <= 40,
    },
    {
      name: 'POST /api/matchups answer (15 balls), JSON',
      value: answerJsonKb,
      unit: 'kB',
      target: null,
      floor: null,
      ratio: null,
      ok: null,
    },
    {
      name: `GET /api/arsenal requests/s (10 concurrent, ${m.listBalls} balls)`,
      value: list.requests.average,
      unit: 'req/s',
      target: '≥ 0.5 × floor',
      floor: floor.rps,
      ratio: ratio(list.requests.average, floor.rps),
      ok: list.requests.average >= 0.5 * floor.rps,
    },
    {
      name: `GET /api/arsenal requests/s (10 concurrent, ${m.bigBalls} balls)`,
      value: listBig.requests.average,
      unit: 'req/s',
      target: '≥ 0.3 × floor',
      floor: floorBig.rps,
      ratio: ratio(listBig.requests.average, floorBig.rps),
      ok: listBig.requests.average >= 0.3 * floorBig.rps,
    },
    {
      name: 'server peak RSS (VmHWM) over the lists and matchups',
      value: rssMb,
      unit: 'MB',
      target: null,
      floor: null,
      ratio: null,
      ok: null,
    },
    { name: 'client initial JS (gzip)', value: jsKb, unit: 'kB', target: '≤ 350', floor: null, ratio: null, ok: jsKb <= 350 },
  ];
  const loadAvg = os.loadavg().map((x) => Math.round(x * 100) / 100);
  console.log(`\nHTTP (autocannon on loopback; floor = bare Express answering the same body, same run; load average ${loadAvg.join(' ')})`);
  for (const h of http)
    console.log(
      `${h.name.padEnd(72)} ${h.value.toFixed(1).padStart(9)} ${h.unit.padEnd(6)} ${h.floor === null ? ''.padEnd(16) : `floor ${h.floor.toFixed(1)}`.padEnd(16)} ${h.ratio === null ? ''.padEnd(9) : `${h.ratio.toFixed(3)} ×`.padEnd(9)} ${h.target ?? ''} ${h.ok === null ? '' : h.ok ? 'ok' : 'MISSED'}`,
    );
  if (errors) console.log(`non-2xx or errors during the load: ${errors}`);

  writeResults('http', { date: new Date().toISOString(), loadAverage: loadAvg, cores: os.cpus().length, errors, results: http });
}
