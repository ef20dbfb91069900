import type { Layout } from '../shared/balls';

export interface DemoBall {
  model: string;
  nickname?: string;
  weightLb: number;
  surfaceGrit?: number;
  polished?: boolean;
  layout: Layout;
  games: number;
  /** Earlier surfaces, oldest first, as [grit, polished, days ago, note]. */
  history?: [number, boolean, number, string][];
}

/** The demo bowlers' arsenals (catalogue names from catalogue.ts). */
export const DEMO_ARSENALS: Record<string, DemoBall[]> = {
  'dana@copperline.example': [
    {
      model: 'Thunderhead Talon',
      nickname: 'Big Red',
      weightLb: 15,
      surfaceGrit: 2000,
      polished: false,
      layout: { pinToPapIn: 4.5, drillingAngleDeg: 50, valAngleDeg: 40 },
      games: 24,
      history: [
        [2000, false, 120, 'Out of the box'],
        [4000, false, 60, 'Took it to 4000 for the summer league'],
        [2000, false, 14, 'Back to 2000 for the heavier fall shot'],
      ],
    },
    { model: 'Crosswind Falchion', weightLb: 15, layout: { pinToPapIn: 5, drillingAngleDeg: 45, valAngleDeg: 45 }, games: 40 },
    {
      model: 'Skylark Arc',
      nickname: 'Backend',
      weightLb: 15,
      layout: { pinToPapIn: 3.5, drillingAngleDeg: 60, valAngleDeg: 30 },
      games: 12,
    },
    { model: 'Deep Root', weightLb: 15, surfaceGrit: 1000, polished: false, layout: { pinToPapIn: 5.5, drillingAngleDeg: 40 }, games: 8 },
    { model: 'Silver Birch Snap', weightLb: 15, layout: { pinToPapIn: 4, drillingAngleDeg: 70 }, games: 55 },
    { model: 'Old Growth', nickname: 'Control', weightLb: 15, layout: { pinToPapIn: 5, drillingAngleDeg: 45 }, games: 30 },
    { model: 'Clear Sky Spare', nickname: 'Spare', weightLb: 14, layout: { pinToPapIn: 3.4, drillingAngleDeg: 45 }, games: 200 },
  ],
  'lee@copperline.example': [
    { model: 'Undertow Keel', weightLb: 16, layout: { pinToPapIn: 5, drillingAngleDeg: 45, valAngleDeg: 50 }, games: 18 },
    { model: 'Ebb Current', weightLb: 16, layout: { pinToPapIn: 4.5, drillingAngleDeg: 55 }, games: 22 },
    { model: 'Riptide Flash', weightLb: 16, layout: { pinToPapIn: 3.75, drillingAngleDeg: 60 }, games: 35 },
    { model: 'Tundra Roll', weightLb: 16, layout: { pinToPapIn: 5, drillingAngleDeg: 45 }, games: 60 },
    { model: 'Heron Wade', weightLb: 16, layout: { pinToPapIn: 4.25, drillingAngleDeg: 50 }, games: 15 },
    { model: 'Still Pool', nickname: 'Spare', weightLb: 15, layout: { pinToPapIn: 3.4, drillingAngleDeg: 45 }, games: 150 },
  ],
  'coach@copperline.example': [
    { model: 'Stormwatch Quill', weightLb: 15, layout: { pinToPapIn: 4.75, drillingAngleDeg: 45, valAngleDeg: 45 }, games: 10 },
    { model: 'Aurora Tangent', weightLb: 15, layout: { pinToPapIn: 4.5, drillingAngleDeg: 50 }, games: 20 },
    { model: 'Comet Veer', weightLb: 15, layout: { pinToPapIn: 3.75, drillingAngleDeg: 65 }, games: 25 },
    { model: 'Slack Water', weightLb: 15, layout: { pinToPapIn: 5, drillingAngleDeg: 45 }, games: 40 },
    { model: 'Pinewood Straight', nickname: 'Spare', weightLb: 14, layout: { pinToPapIn: 3.4, drillingAngleDeg: 45 }, games: 300 },
    { model: 'Knotted Burl', weightLb: 15, layout: { pinToPapIn: 5.25, drillingAngleDeg: 40, valAngleDeg: 55 }, games: 5 },
  ],
};
