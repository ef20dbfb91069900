import type { Sweep } from '../../engine/types';
import type { BallModelInput } from '../../shared/balls';
import { arsenalRepository, catalogueSpecsOf } from '../../server/features/arsenal/arsenal.repository';
import { summarize } from '../../server/features/patterns/patterns.service';
import { Ball, BallModel, Center, Lane, Pattern } from '../../server/models/index';

let n = 0;
const uniq = () => `${process.pid}-${Date.now()}-${++n}`;

export const STRONG_SOLID: Omit<BallModelInput, 'maker' | 'name'> = {
  coverType: 'reactive-solid',
  coreType: 'asymmetric',
  rg: 2.48,
  differential: 0.054,
  intermediateDifferential: 0.018,
  factoryGrit: 1000,
  factoryPolished: false,
  hardnessD: 76,
  releaseYear: 2026,
};
export const POLISHED_PEARL: Omit<BallModelInput, 'maker' | 'name'> = {
  coverType: 'reactive-pearl',
  coreType: 'symmetric',
  rg: 2.56,
  differential: 0.036,
  intermediateDifferential: 0,
  factoryGrit: 5000,
  factoryPolished: true,
  hardnessD: 79,
  releaseYear: 2025,
};
export const URETHANE: Omit<BallModelInput, 'maker' | 'name'> = {
  coverType: 'urethane',
  coreType: 'symmetric',
  rg: 2.62,
  differential: 0.018,
  intermediateDifferential: 0,
  factoryGrit: 3000,
  factoryPolished: false,
  hardnessD: 79,
  releaseYear: 2024,
};
export const PLASTIC: Omit<BallModelInput, 'maker' | 'name'> = {
  coverType: 'plastic',
  coreType: 'symmetric',
  rg: 2.7,
  differential: 0.006,
  intermediateDifferential: 0,
  factoryGrit: 5000,
  factoryPolished: true,
  hardnessD: 83,
  releaseYear: 2023,
};

export async function createModel(
  spec: Omit<BallModelInput, 'maker' | 'name'> = STRONG_SOLID,
  name = `Test Sphere ${uniq()}`,
): Promise<BallModel> {
  return BallModel.create({
    maker: 'Test Foundry',
    name,
    ...spec,
    hardnessD: spec.hardnessD ?? null,
    releaseYear: spec.releaseYear ?? null,
  });
}

/** A ball owned by `ownerId`, copied from a new catalogue model with the given specs. */
export async function createBall(
  ownerId: number,
  spec: Omit<BallModelInput, 'maker' | 'name'> = STRONG_SOLID,
  over: Partial<{ surfaceGrit: number; polished: boolean; status: 'active' | 'retired' }> = {},
): Promise<Ball> {
  const m = await createModel(spec);
  return arsenalRepository.createWithFirstSurface(
    {
      ownerId,
      ...catalogueSpecsOf(m),
      nickname: null,
      weightLb: 15,
      surfaceGrit: over.surfaceGrit ?? m.factoryGrit,
      polished: over.polished ?? m.factoryPolished,
      layout: { pinToPapIn: 4.5, drillingAngleDeg: 45 },
      gamesSinceResurface: 10,
      status: over.status ?? 'active',
    },
    null,
  );
}

const sw = (
  direction: Sweep['direction'],
  fromBoard: number,
  toBoard: number,
  endFt: number,
  crossings: number,
  microlitersPerBoard: number,
): Sweep => ({
  direction,
  fromBoard,
  toBoard,
  startFt: 0,
  endFt,
  crossings,
  microlitersPerBoard,
});

/** Test patterns whose classes follow from Lanewright's conventions table (engine/README.md) (length ≥ 43 ft long, < 37 ft short; > 25 mL heavy, < 20 mL light). */
export const LONG_HEAVY: Sweep[] = [
  sw('forward', 2, 38, 48, 4, 70),
  sw('forward', 8, 32, 45, 4, 70),
  sw('forward', 14, 26, 42, 4, 70),
  sw('reverse', 2, 38, 38, 2, 70),
];
export const SHORT_LIGHT: Sweep[] = [sw('forward', 3, 37, 33, 2, 50), sw('forward', 10, 30, 31, 2, 50), sw('reverse', 15, 25, 28, 2, 50)];

export async function createPattern(
  ownerId: number | null,
  sweeps: Sweep[] = LONG_HEAVY,
  name = `Test Pattern ${uniq()}`,
): Promise<Pattern> {
  return Pattern.create({ ownerId, name, description: null, sweeps, summary: summarize({ name, sweeps }) });
}

/** A center with its lanes, owned by `ownerId`. */
export async function createCenter(ownerId: number | null, laneCount = 24): Promise<Center> {
  const c = await Center.create({ name: `Test Lanes ${uniq()}`, town: 'Testford', laneCount, ownerId });
  await Lane.bulkCreate(Array.from({ length: laneCount }, (_, i) => ({ centerId: c.id, number: i + 1, notes: null })));
  return c;
}
