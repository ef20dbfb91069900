// Test-side helpers for logged games: a game is written frame by frame as the pins standing after each delivery.
import { randomUUID } from 'node:crypto';
import { CoachLink } from '../../../server/models/index';
import { api } from '../../helpers/api';
import { mulberry32 as rng } from '../../../shared/random';

export const ALL_PINS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10];

/** One frame: the pins standing after each of its deliveries (a strike is [[]]). */
export type FrameLog = number[][];

export interface Delivery {
  frame: number;
  delivery: number;
  standing: number[];
  foul?: boolean;
}

/**
 * The deliveries of a game and the pins each knocks down (scoreGame's rolls), written independently of the
 * engine from the frame-by-frame standing lists: a new rack has 10 pins; in frame 10 the rack is re-set after
 * a strike or a spare (USBC playing rules).
 */
export function expandGame(frames: FrameLog[]): { deliveries: Delivery[]; rolls: number[] } {
  const deliveries: Delivery[] = [];
  const rolls: number[] = [];
  frames.forEach((frame, i) => {
    let before = 10;
    frame.forEach((standing, j) => {
      deliveries.push({ frame: i + 1, delivery: j + 1, standing });
      rolls.push(before - standing.length);
      before = standing.length === 0 && i === 9 ? 10 : standing.length;
    });
  });
  return { deliveries, rolls };
}

/** A strike, a spare, a 7-10 split, a nine-and-miss and a tenth frame of strike, 8 and spare. */
export const SAMPLE_GAME: FrameLog[] = [
  [[]], // X
  [[10], []], // 9 /
  [[7, 10], [7]], // split 7-10, 8 then 1
  [[]], // X
  [[]], // X
  [[4, 7], []], // 8 /
  [[1, 2, 4, 7], [2]], // 6, 3
  [[6], [6]], // 9 -
  [[2, 4, 5, 8], []], // 6 /
  [[], [3, 6], []], // X 8 /
];

const subset = (pins: number[], rand: () => number, keep: number) => pins.filter(() => rand() < keep);

/** A random complete game: each pin of a rack stays up with some probability, strikes and spares included. */
export function randomGame(seed: number): FrameLog[] {
  const rand = rng(seed);
  const frames: FrameLog[] = [];
  for (let f = 1; f <= 10; f++) {
    const keep = rand() < 0.35 ? 0 : 0.25;
    const first = subset(ALL_PINS, rand, keep);
    if (f < 10) {
      frames.push(first.length === 0 ? [first] : [first, subset(first, rand, rand() < 0.5 ? 0 : 0.4)]);
      continue;
    }
    const frame: number[][] = [first];
    let rack = first.length === 0 ? ALL_PINS : first;
    const second = first.length === 0 ? subset(ALL_PINS, rand, keep) : subset(first, rand, rand() < 0.5 ? 0 : 0.4);
    frame.push(second);
    if (first.length === 0 || second.length === 0) {
      rack = second.length === 0 ? ALL_PINS : second;
      frame.push(subset(rack, rand, 0.3));
    }
    frames.push(frame);
  }
  return frames;
}

export const newKey = () => `shot-${randomUUID()}`;

/** Logs every delivery of a game through the API (each with its own key); returns the last answer. */
export async function logGame(
  auth: { Authorization: string },
  sessionId: number,
  gameNumber: number,
  frames: FrameLog[],
  extra: (d: Delivery, i: number) => Record<string, unknown> = () => ({}),
  ballId?: number | ((d: Delivery, i: number) => number),
): Promise<{ status: number; body: Record<string, unknown> }> {
  const { deliveries } = expandGame(frames);
  let last: { status: number; body: Record<string, unknown> } = { status: 0, body: {} };
  for (const [i, d] of deliveries.entries()) {
    const ball = typeof ballId === 'function' ? ballId(d, i) : ballId;
    const res = await api
      .post(`/api/sessions/${sessionId}/shots`)
      .set(auth)
      .set('Idempotency-Key', newKey())
      .send({ gameNumber, ...d, ...(ball !== undefined ? { ballId: ball } : {}), ...extra(d, i) });
    if (res.status !== 201)
      throw new Error(`delivery ${i + 1} (frame ${d.frame}, delivery ${d.delivery}): ${res.status} ${JSON.stringify(res.body)}`);
    last = { status: res.status, body: res.body as Record<string, unknown> };
  }
  return last;
}

/** A coach ↔ student link straight in the database (the coaching tests exercise the invitation flow itself). */
export async function linkRow(
  coachId: number,
  student: { id: number; email: string },
  status: 'pending' | 'active' | 'revoked' = 'active',
) {
  return CoachLink.create({
    coachId,
    studentId: student.id,
    email: student.email,
    status,
    acceptedAt: status === 'pending' ? null : new Date(),
    revokedAt: status === 'revoked' ? new Date() : null,
    revokedBy: status === 'revoked' ? coachId : null,
  });
}
