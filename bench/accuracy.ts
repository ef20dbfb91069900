/**
 * Accuracy of the ball-motion model's production steps (`npm run bench:accuracy`, part of `npm run bench`).
 *
 * Over the demo arsenals, bowlers and patterns (fresh and after 6 games), every ranking is computed twice: with the
 * production steps (MOTION_CALIBRATION.stepS near rolling, maxStepS while the ball slides fast) and with a 1 ms fixed
 * step everywhere (withMotionSteps), the reference. Reported, as the largest and the 95th-percentile difference:
 * - on the production line itself (the same laydown and target thrown at both steps): entry board, entry angle,
 *   breakpoint distance — the model's own numerical error (targets: 0.2 board, 0.3°, 1 ft);
 * - between the two rankings: the line each chose (laydown and target), the entry angle and breakpoint on it, the
 *   score; and how many rankings changed order or advice (suggestion kinds and their changes, not the figures).
 * Warm start (the server's rankings start each ball's line search where it settled on a nearby condition): every
 * ranking is computed again with the hints a ranking of the same arsenal WARM_FROM_GAMES games later left (the
 * farthest apart two inputs that share a cached hint can be), and compared with the cold ranking at the same
 * steps — order, advice, the line, entry board and angle, breakpoint (targets: unchanged, unchanged, —, 0.2 board,
 * 0.3°, 1 ft) — and with the 1 ms reference on the same figures. The deliveries each needs are counted.
 * Written to bench/results.json under "accuracy". Invented demo data only; the reference is the model itself at a
 * fine step, so this measures the integration, not the physics.
 */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { quantile } from 'simple-statistics';
import { conditionOilMap, prepareShot, rankArsenal, withMotionSteps } from '../engine/index';
import type { ArsenalBall, BowlerProfile, PocketLineHint, RankedBallWithPrediction } from '../engine/index';
import { DEMO_ARSENALS } from '../seeders/arsenals';
import { DEMO_CATALOGUE } from '../seeders/catalogue';
import { DEMO_PATTERNS } from '../seeders/patterns';
import { DEMO_USERS } from '../seeders/users';

const REFERENCE = { stepS: 0.001, maxStepS: 0.001 };
/** How far (games bowled) the condition whose hints warm-start a ranking lies from it: the server shares hints among inputs within one 0.05-game bucket, so less than 0.05 apart. */
const WARM_FROM_GAMES = Number(process.env.WARM_FROM_GAMES ?? 0.049);
const TARGETS = { entryBoard: 0.2, entryAngleDeg: 0.3, breakpointFt: 1 };

interface Case {
  label: string;
  balls: ArsenalBall[];
  bowler: BowlerProfile;
  pattern: (typeof DEMO_PATTERNS)[number];
  gamesBowled: number;
}

function cases(): Case[] {
  const out: Case[] = [];
  for (const [email, arsenal] of Object.entries(DEMO_ARSENALS)) {
    const profile = DEMO_USERS.find((u) => u.email === email)?.profile;
    if (!profile) continue;
    const bowler: BowlerProfile = {
      hand: profile.hand,
      speedMph: profile.speedMph,
      revRpm: profile.revRpm,
      axisRotationDeg: profile.axisRotationDeg,
      axisTiltDeg: profile.axisTiltDeg,
    };
    const balls: ArsenalBall[] = arsenal.map((d, i) => {
      const m = DEMO_CATALOGUE.find((x) => x.name === d.model);
      if (!m) throw new Error(`accuracy: no catalogue ball ${d.model}`);
      return {
        id: `${i + 1}`,
        weightLb: d.weightLb,
        rg: m.rg,
        differential: m.differential,
        intermediateDifferential: m.intermediateDifferential,
        coverType: m.coverType,
        surfaceGrit: d.surfaceGrit ?? m.factoryGrit,
        polished: d.polished ?? m.factoryPolished,
        layout: {
          pinToPapIn: d.layout.pinToPapIn,
          ...(d.layout.drillingAngleDeg != null ? { drillingAngleDeg: d.layout.drillingAngleDeg } : {}),
          ...(d.layout.valAngleDeg != null ? { valAngleDeg: d.layout.valAngleDeg } : {}),
        },
      };
    });
    for (const pattern of DEMO_PATTERNS)
      for (const gamesBowled of [0, 6])
        out.push({ label: `${email.split('@')[0]} · ${pattern.name} · ${gamesBowled} games`, balls, bowler, pattern, gamesBowled });
  }
  return out;
}

const advice = (r: RankedBallWithPrediction) =>
  r.suggestions
    .map(
      (s) =>
        `${s.kind}:${JSON.stringify(s.change ? Object.fromEntries(Object.entries(s.change).filter(([k]) => k !== 'sameLine' && k !== 'laydownBoard' && k !== 'targetBoard')) : null)}`,
    )
    .join(';');

function summary(xs: number[]) {
  const s = [...xs].sort((a, b) => a - b);
  return { max: Math.round(s[s.length - 1] * 1000) / 1000, p95: Math.round(quantile(s, 0.95) * 1000) / 1000 };
}

function main(): void {
  const sameLine = { entryBoard: [] as number[], entryAngleDeg: [] as number[], breakpointFt: [] as number[] };
  const between = { lineBoards: [] as number[], entryAngleDeg: [] as number[], breakpointFt: [] as number[], score: [] as number[] };
  let rankings = 0,
    balls = 0,
    orderChanged = 0,
    adviceChanged = 0;
  const changes: string[] = [];
  const warmVsCold = {
    lineBoards: [] as number[],
    entryBoard: [] as number[],
    entryAngleDeg: [] as number[],
    breakpointFt: [] as number[],
  };
  const warmVsRef = { entryBoard: [] as number[], entryAngleDeg: [] as number[], breakpointFt: [] as number[] };
  let warmOrderChanged = 0,
    warmAdviceChanged = 0,
    warmRefOrderChanged = 0,
    warmRefAdviceChanged = 0;
  const warmChanges: string[] = [];
  for (const c of cases()) {
    const input = { balls: c.balls, bowler: c.bowler, pattern: c.pattern, gamesBowled: c.gamesBowled };
    const fast = rankArsenal(input);
    const ref = withMotionSteps(REFERENCE, () => rankArsenal(input));
    // the same-line check throws both deliveries on the production ranking's lane (its transition map)
    const map = conditionOilMap(c.pattern, c.bowler, c.gamesBowled);
    // warm: hints left by the ranking of a nearby condition
    const hints = new Map<string, PocketLineHint>();
    rankArsenal({ ...input, gamesBowled: c.gamesBowled + WARM_FROM_GAMES }, { onSettled: (id, h) => hints.set(id, h) });
    const warm = rankArsenal(input, { hints });
    if (warm.map((r) => r.id).join() !== fast.map((r) => r.id).join()) {
      warmOrderChanged++;
      warmChanges.push(`order (warm vs cold): ${c.label}`);
    }
    if (warm.map((r) => r.id).join() !== ref.map((r) => r.id).join()) warmRefOrderChanged++;
    for (const w of warm) {
      const f = fast.find((x) => x.id === w.id)!,
        q = ref.find((x) => x.id === w.id)!;
      if (advice(w) !== advice(f)) {
        warmAdviceChanged++;
        warmChanges.push(`advice (warm vs cold): ${c.label}, ball ${w.id}`);
      }
      if (advice(w) !== advice(q)) warmRefAdviceChanged++;
      const a = w.prediction,
        b = f.prediction,
        r = q.prediction;
      warmVsCold.lineBoards.push(Math.max(Math.abs(a.laydownBoard - b.laydownBoard), Math.abs(a.targetBoard - b.targetBoard)));
      warmVsCold.entryBoard.push(Math.abs(a.entryBoard - b.entryBoard));
      warmVsCold.entryAngleDeg.push(Math.abs(a.entryAngleDeg - b.entryAngleDeg));
      warmVsCold.breakpointFt.push(Math.abs(a.breakpoint.ft - b.breakpoint.ft));
      warmVsRef.entryBoard.push(Math.abs(a.entryBoard - r.entryBoard));
      warmVsRef.entryAngleDeg.push(Math.abs(a.entryAngleDeg - r.entryAngleDeg));
      warmVsRef.breakpointFt.push(Math.abs(a.breakpoint.ft - r.breakpoint.ft));
      if (
        Math.abs(a.entryAngleDeg - b.entryAngleDeg) > TARGETS.entryAngleDeg ||
        Math.abs(a.breakpoint.ft - b.breakpoint.ft) > TARGETS.breakpointFt ||
        Math.abs(a.entryBoard - b.entryBoard) > TARGETS.entryBoard
      ) {
        warmChanges.push(
          `line (warm vs cold): ${c.label}, ball ${w.id}: laid down ${a.laydownBoard.toFixed(1)} over ${a.targetBoard.toFixed(1)} (entry ${a.entryAngleDeg.toFixed(2)}°), cold ${b.laydownBoard.toFixed(1)} over ${b.targetBoard.toFixed(1)} (entry ${b.entryAngleDeg.toFixed(2)}°)`,
        );
      }
    }
    rankings++;
    if (fast.map((r) => r.id).join() !== ref.map((r) => r.id).join()) {
      orderChanged++;
      changes.push(`order: ${c.label}`);
    }
    for (const r of fast) {
      const q = ref.find((x) => x.id === r.id)!;
      balls++;
      if (advice(r) !== advice(q)) {
        adviceChanged++;
        changes.push(`advice: ${c.label}, ball ${r.id}`);
      }
      const p = r.prediction;
      between.lineBoards.push(
        Math.max(Math.abs(p.laydownBoard - q.prediction.laydownBoard), Math.abs(p.targetBoard - q.prediction.targetBoard)),
      );
      between.entryAngleDeg.push(Math.abs(p.entryAngleDeg - q.prediction.entryAngleDeg));
      between.breakpointFt.push(Math.abs(p.breakpoint.ft - q.prediction.breakpoint.ft));
      between.score.push(Math.abs(r.score - q.score));
      const ball = c.balls.find((b) => b.id === r.id)!;
      const prepared = prepareShot({ ball, bowler: c.bowler, pattern: c.pattern, gamesBowled: c.gamesBowled }, map);
      const a = prepared.run(p.laydownBoard, p.targetBoard),
        b = withMotionSteps(REFERENCE, () => prepared.run(p.laydownBoard, p.targetBoard));
      sameLine.entryBoard.push(Math.abs(a.entryBoard - b.entryBoard));
      sameLine.entryAngleDeg.push(Math.abs(a.entryAngleDeg - b.entryAngleDeg));
      sameLine.breakpointFt.push(Math.abs(a.breakpointFt - b.breakpointFt));
      if (between.lineBoards[between.lineBoards.length - 1] > 1)
        changes.push(
          `line: ${c.label}, ball ${r.id}: laid down ${p.laydownBoard.toFixed(1)} over ${p.targetBoard.toFixed(1)}, reference ${q.prediction.laydownBoard.toFixed(1)} over ${q.prediction.targetBoard.toFixed(1)}`,
        );
    }
  }
  const accuracy = {
    reference: '1 ms fixed RK4 step',
    rankings,
    balls,
    sameLine: {
      entryBoard: summary(sameLine.entryBoard),
      entryAngleDeg: summary(sameLine.entryAngleDeg),
      breakpointFt: summary(sameLine.breakpointFt),
    },
    targets: TARGETS,
    withinTargets:
      Math.max(...sameLine.entryBoard) <= TARGETS.entryBoard &&
      Math.max(...sameLine.entryAngleDeg) <= TARGETS.entryAngleDeg &&
      Math.max(...sameLine.breakpointFt) <= TARGETS.breakpointFt,
    betweenRankings: {
      lineBoards: summary(between.lineBoards),
      entryAngleDeg: summary(between.entryAngleDeg),
      breakpointFt: summary(between.breakpointFt),
      score: summary(between.score),
      orderChanged,
      adviceChanged,
      changes,
    },
    warmStart: {
      hintsFromGamesAway: WARM_FROM_GAMES,
      againstCold: {
        lineBoards: summary(warmVsCold.lineBoards),
        entryBoard: summary(warmVsCold.entryBoard),
        entryAngleDeg: summary(warmVsCold.entryAngleDeg),
        breakpointFt: summary(warmVsCold.breakpointFt),
        orderChanged: warmOrderChanged,
        adviceChanged: warmAdviceChanged,
      },
      againstReference: {
        entryBoard: summary(warmVsRef.entryBoard),
        entryAngleDeg: summary(warmVsRef.entryAngleDeg),
        breakpointFt: summary(warmVsRef.breakpointFt),
        orderChanged: warmRefOrderChanged,
        adviceChanged: warmRefAdviceChanged,
      },
      withinTargets:
        warmOrderChanged === 0 &&
        warmAdviceChanged === 0 &&
        Math.max(...warmVsCold.entryBoard) <= TARGETS.entryBoard &&
        Math.max(...warmVsCold.entryAngleDeg) <= TARGETS.entryAngleDeg &&
        Math.max(...warmVsCold.breakpointFt) <= TARGETS.breakpointFt,
      changes: warmChanges,
    },
  };
  const rows = [
    ['on the same line', 'max', 'p95', 'target'],
    ['entry board, boards', String(accuracy.sameLine.entryBoard.max), String(accuracy.sameLine.entryBoard.p95), String(TARGETS.entryBoard)],
    [
      'entry angle, °',
      String(accuracy.sameLine.entryAngleDeg.max),
      String(accuracy.sameLine.entryAngleDeg.p95),
      String(TARGETS.entryAngleDeg),
    ],
    [
      'breakpoint, ft',
      String(accuracy.sameLine.breakpointFt.max),
      String(accuracy.sameLine.breakpointFt.p95),
      String(TARGETS.breakpointFt),
    ],
  ];
  console.log(`accuracy against a ${accuracy.reference}: ${rankings} rankings, ${balls} balls`);
  for (const r of rows) console.log(r.map((x, i) => (i === 0 ? x.padEnd(22) : x.padStart(8))).join(''));
  console.log(
    `between the rankings: line ${accuracy.betweenRankings.lineBoards.max} boards max, entry angle ${accuracy.betweenRankings.entryAngleDeg.max}° max, breakpoint ${accuracy.betweenRankings.breakpointFt.max} ft max, score ${accuracy.betweenRankings.score.max} points max; order changed in ${orderChanged} of ${rankings}, advice in ${adviceChanged} of ${balls}`,
  );
  for (const c of changes) console.log(`  ${c}`);
  const w = accuracy.warmStart;
  console.log(
    `warm start (hints from ${WARM_FROM_GAMES} games away) against the cold ranking: entry board ${w.againstCold.entryBoard.max} max, entry angle ${w.againstCold.entryAngleDeg.max}° max, breakpoint ${w.againstCold.breakpointFt.max} ft max, line ${w.againstCold.lineBoards.max} boards max; order changed in ${w.againstCold.orderChanged} of ${rankings}, advice in ${w.againstCold.adviceChanged} of ${balls}${w.withinTargets ? ' (within targets)' : ' (OUTSIDE targets)'}`,
  );
  console.log(
    `warm start against the 1 ms reference: entry board ${w.againstReference.entryBoard.max} max, entry angle ${w.againstReference.entryAngleDeg.max}° max, breakpoint ${w.againstReference.breakpointFt.max} ft max; order changed in ${w.againstReference.orderChanged} of ${rankings}, advice in ${w.againstReference.adviceChanged} of ${balls}`,
  );
  for (const c of w.changes) console.log(`  ${c}`);
  const here = path.dirname(fileURLToPath(import.meta.url));
  const file = path.join(here, 'results.json');
  const prev = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
  fs.writeFileSync(file, `${JSON.stringify({ ...prev, accuracy }, null, 2)}\n`);
  console.log('wrote bench/results.json (accuracy)');
  if (!accuracy.withinTargets || !accuracy.warmStart.withinTargets) process.exitCode = 1;
}

main();
