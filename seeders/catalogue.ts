import type { BallModelInput } from '../shared/balls';

type Row = [
  maker: string,
  name: string,
  cover: BallModelInput['coverType'],
  rg: number,
  diff: number,
  intDiff: number,
  grit: number,
  polished: boolean,
  hardness: number,
  year: number,
];

/**
 * The demo catalogue: invented makers and balls, every spec inside the current legal limits
 * (RG 2.460–2.800 in, differential ≤ 0.060 in, hardness ≥ 73 D; USBC equipment specifications).
 */
const ROWS: Row[] = [
  // reactive solids — strongest in oil
  ['Kestrel Works', 'Thunderhead Talon', 'reactive-solid', 2.48, 0.054, 0.018, 2000, false, 76, 2026],
  ['Kestrel Works', 'Stormwatch Quill', 'reactive-solid', 2.5, 0.05, 0.012, 2000, false, 77, 2025],
  ['Ironbark', 'Deep Root', 'reactive-solid', 2.49, 0.052, 0.016, 1500, false, 75, 2026],
  ['Ironbark', 'Heartwood Anchor', 'reactive-solid', 2.52, 0.046, 0, 2000, false, 76, 2024],
  ['Tidewell Forge', 'Undertow Keel', 'reactive-solid', 2.47, 0.058, 0.02, 1000, false, 75, 2026],
  ['Tidewell Forge', 'Basalt Drift', 'reactive-solid', 2.55, 0.04, 0, 3000, false, 77, 2023],
  ['Northlight Spheres', 'Polar Grip', 'reactive-solid', 2.51, 0.048, 0.01, 2000, false, 76, 2025],
  ['Saltmarsh Labs', 'Reedbed Crawler', 'reactive-solid', 2.53, 0.044, 0.006, 3000, false, 78, 2024],
  // reactive hybrids — blend of read and length
  ['Kestrel Works', 'Crosswind Falchion', 'reactive-hybrid', 2.5, 0.05, 0.014, 3000, true, 77, 2026],
  ['Ironbark', 'Split Grain', 'reactive-hybrid', 2.53, 0.045, 0, 4000, false, 77, 2025],
  ['Tidewell Forge', 'Ebb Current', 'reactive-hybrid', 2.49, 0.051, 0.015, 3000, false, 76, 2025],
  ['Northlight Spheres', 'Aurora Tangent', 'reactive-hybrid', 2.54, 0.042, 0, 4000, true, 78, 2024],
  ['Saltmarsh Labs', 'Heron Wade', 'reactive-hybrid', 2.56, 0.038, 0, 3000, false, 77, 2023],
  ['Northlight Spheres', 'Glacier Shear', 'reactive-hybrid', 2.48, 0.055, 0.019, 2000, true, 76, 2026],
  // reactive pearls — length and a sharp backend
  ['Kestrel Works', 'Skylark Arc', 'reactive-pearl', 2.52, 0.048, 0.011, 4000, true, 78, 2026],
  ['Kestrel Works', 'Tailwind Glide', 'reactive-pearl', 2.56, 0.036, 0, 5000, true, 79, 2024],
  ['Ironbark', 'Silver Birch Snap', 'reactive-pearl', 2.54, 0.044, 0, 4000, true, 78, 2025],
  ['Tidewell Forge', 'Riptide Flash', 'reactive-pearl', 2.5, 0.05, 0.016, 4000, true, 77, 2026],
  ['Northlight Spheres', 'Comet Veer', 'reactive-pearl', 2.55, 0.04, 0.008, 5000, true, 79, 2025],
  ['Saltmarsh Labs', 'Tern Dive', 'reactive-pearl', 2.58, 0.032, 0, 4000, true, 79, 2023],
  ['Saltmarsh Labs', 'Mudflat Skimmer', 'reactive-pearl', 2.6, 0.028, 0, 5000, true, 80, 2022],
  // urethane — smooth, controllable, for dry or flat conditions
  ['Ironbark', 'Old Growth', 'urethane', 2.6, 0.022, 0, 2000, false, 78, 2024],
  ['Kestrel Works', 'Hovering Kite', 'urethane', 2.62, 0.018, 0, 3000, false, 79, 2025],
  ['Tidewell Forge', 'Slack Water', 'urethane', 2.58, 0.026, 0, 2000, false, 77, 2026],
  ['Northlight Spheres', 'Tundra Roll', 'urethane', 2.65, 0.016, 0, 4000, true, 80, 2023],
  ['Saltmarsh Labs', 'Brackish Line', 'urethane', 2.6, 0.024, 0.004, 2000, false, 78, 2025],
  // plastic — spare balls, straight
  ['Kestrel Works', 'Clear Sky Spare', 'plastic', 2.68, 0.008, 0, 5000, true, 82, 2024],
  ['Ironbark', 'Pinewood Straight', 'plastic', 2.7, 0.006, 0, 5000, true, 83, 2023],
  ['Tidewell Forge', 'Still Pool', 'plastic', 2.72, 0.005, 0, 5000, true, 82, 2025],
  ['Northlight Spheres', 'Icicle Line', 'plastic', 2.69, 0.01, 0, 5000, true, 84, 2026],
  ['Saltmarsh Labs', 'Glass Tide', 'plastic', 2.71, 0.007, 0, 5000, true, 83, 2022],
  // more reactive options across the range
  ['Ironbark', 'Knotted Burl', 'reactive-solid', 2.5, 0.05, 0.022, 2000, false, 75, 2026],
  ['Tidewell Forge', 'Pressure Ridge', 'reactive-hybrid', 2.51, 0.049, 0.009, 2000, false, 76, 2024],
  ['Kestrel Works', 'Dusk Hover', 'reactive-pearl', 2.57, 0.034, 0, 4000, true, 79, 2023],
];

export const DEMO_CATALOGUE: BallModelInput[] = ROWS.map(
  ([maker, name, coverType, rg, differential, intermediateDifferential, factoryGrit, factoryPolished, hardnessD, releaseYear]) => ({
    maker,
    name,
    coverType,
    coreType: intermediateDifferential > 0 ? 'asymmetric' : 'symmetric',
    rg,
    differential,
    intermediateDifferential,
    factoryGrit,
    factoryPolished,
    hardnessD,
    releaseYear,
  }),
);
