import type { Sweep } from '../engine/types';

const s = (
  direction: Sweep['direction'],
  fromBoard: number,
  toBoard: number,
  startFt: number,
  endFt: number,
  crossings: number,
  microlitersPerBoard: number,
): Sweep => ({
  direction,
  fromBoard,
  toBoard,
  startFt,
  endFt,
  crossings,
  microlitersPerBoard,
});

/**
 * The demo patterns, designed for Lanewright (invented names). Their computed classes are checked when seeded:
 * a typical house shot (medium length, medium volume, recreation ratio), a long heavy pattern, a short light
 * pattern and a flat sport pattern.
 */
export const DEMO_PATTERNS: {
  name: string;
  description: string;
  sweeps: Sweep[];
  expect: { lengthClass: string; volumeClass: string; ratioClass: string };
}[] = [
  {
    name: 'Copperline House 40',
    description: 'The everyday league condition at Copperline Bowl: oil stacked in the middle, a dry outside that guides the ball back.',
    sweeps: [
      s('forward', 2, 38, 0, 40, 2, 65),
      s('forward', 8, 32, 0, 38, 4, 65),
      s('forward', 13, 27, 0, 36, 6, 65),
      s('reverse', 16, 24, 0, 32, 6, 65),
    ],
    expect: { lengthClass: 'medium', volumeClass: 'medium', ratioClass: 'recreation' },
  },
  {
    name: 'Long Haul 47',
    description: 'A long, heavy tournament condition: plenty of oil far down the lane, for strong, early-reading balls.',
    sweeps: [
      s('forward', 2, 38, 0, 47, 2, 60),
      s('forward', 6, 34, 0, 44, 4, 60),
      s('forward', 10, 30, 0, 42, 4, 60),
      s('forward', 15, 25, 0, 40, 4, 60),
      s('reverse', 2, 38, 0, 36, 2, 60),
      s('reverse', 12, 28, 0, 34, 4, 60),
    ],
    expect: { lengthClass: 'long', volumeClass: 'heavy', ratioClass: 'challenge' },
  },
  {
    name: 'Short Sprint 34',
    description: 'A short, light condition: the lane hooks early, so weaker covers and smoother surfaces keep the ball in play.',
    sweeps: [
      s('forward', 3, 37, 0, 34, 2, 60),
      s('forward', 10, 30, 0, 32, 4, 60),
      s('forward', 14, 26, 0, 30, 4, 60),
      s('reverse', 16, 24, 0, 28, 4, 60),
    ],
    expect: { lengthClass: 'short', volumeClass: 'light', ratioClass: 'recreation' },
  },
  {
    name: 'Level Field 41',
    description: 'A flat sport condition: nearly as much oil outside as in the middle, so misses are not forgiven.',
    sweeps: [
      s('forward', 2, 38, 0, 41, 4, 66),
      s('forward', 5, 35, 0, 39, 2, 66),
      s('forward', 12, 28, 0, 37, 2, 66),
      s('reverse', 2, 38, 0, 33, 2, 66),
    ],
    expect: { lengthClass: 'medium', volumeClass: 'medium', ratioClass: 'sport' },
  },
];
