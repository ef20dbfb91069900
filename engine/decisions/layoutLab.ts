import { DEFAULT_BALL_DIAMETER_IN } from '../constants';
import { MOTION_CALIBRATION } from '../motion/motionCalibration';
import { simulateShot } from '../motion/simulateShot';
import type { ShotPrediction } from '../motion/shotPrediction';
import { pinToPapAngleDeg } from '../pinToPapAngleDeg';
import type { BallLayout, BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';
import { validateBallSpec } from '../validateBallSpec';

type Vec = [number, number, number];

/** A point of the drawing: inches on the PAP-centred map (x to the right, y up toward the pin side). */
export interface MapPoint {
  x: number;
  y: number;
}

export interface LayoutLabEntry {
  id: string;
  label: string;
  layout: BallLayout;
  /** The ball-motion model's flare for this layout on the condition (inches of arc the spin axis moved). */
  flareIn: number;
  pap: MapPoint;
  pin: MapPoint;
  /** The mass-bias (PSA) mark, 90° from the pin turned by the VAL angle (null for a symmetric core). */
  massBias: MapPoint | null;
  /** The spin axis from release (the PAP) to the pins: the centres of the rings. */
  axes: MapPoint[];
  /** The track rings from release to the pins: each a closed polyline on the map (points past the map edge dropped). */
  rings: MapPoint[][];
  prediction: ShotPrediction;
}

/** The drawing's extent: the whole ball, up to the point opposite the PAP (half the circumference of a full-size 8.595 in ball). */
export const LAYOUT_MAP_RADIUS_IN = 13.5;

const norm = (v: Vec): Vec => {
  const n = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / n, v[1] / n, v[2] / n];
};
const cross = (a: Vec, b: Vec): Vec => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
const dot = (a: Vec, b: Vec) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const add = (a: Vec, b: Vec, s = 1): Vec => [a[0] + s * b[0], a[1] + s * b[1], a[2] + s * b[2]];
const scale = (a: Vec, s: number): Vec => [a[0] * s, a[1] * s, a[2] * s];

/** Rodrigues' rotation of v about the unit axis k by angle a. */
function rotate(v: Vec, k: Vec, a: number): Vec {
  const c = Math.cos(a),
    s = Math.sin(a);
  return add(add(scale(v, c), scale(cross(k, v), s)), scale(k, dot(k, v) * (1 - c)));
}

/** Azimuthal equidistant map around the PAP (0, 0, 1): distance from the PAP is true arc length in inches. */
function toMap(v: Vec, radiusIn: number): MapPoint | null {
  const c = Math.acos(Math.max(-1, Math.min(1, v[2])));
  const rho = c * radiusIn;
  if (rho > LAYOUT_MAP_RADIUS_IN + 1e-9) return null;
  const s = Math.hypot(v[0], v[1]);
  if (s < 1e-12) return { x: 0, y: 0 };
  return { x: (rho * v[1]) / s, y: (rho * v[0]) / s };
}

/** Points at angular distance `radiusRad` around the unit vector `centre`. */
function circle(centre: Vec, radiusRad: number, points: number): Vec[] {
  const helper: Vec = Math.abs(centre[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
  const e1 = norm(cross(centre, helper)),
    e2 = cross(centre, e1);
  const out: Vec[] = [];
  for (let i = 0; i <= points; i++) {
    const t = (2 * Math.PI * i) / points;
    out.push(
      add(
        scale(centre, Math.cos(radiusRad)),
        add(scale(e1, Math.cos(t) * Math.sin(radiusRad)), scale(e2, Math.sin(t) * Math.sin(radiusRad))),
      ),
    );
  }
  return out;
}

/**
 * The geometry of a layout on the ball, in the PAP's frame: the PAP at the north pole, the pin on the great circle
 * toward "up" at the pin-to-PAP angle, the mass-bias mark (PSA) 90° from the pin with the VAL angle between the
 * pin–PAP line and the pin–PSA line (mirrored for a left-hander). Source: the layout terms of the USBC equipment
 * specifications' glossary (pin, PAP, mass bias) and spherical geometry.
 */
function layoutPoints(pinToPapIn: number, valAngleDeg: number, diameterIn: number, hand: 1 | -1): { pap: Vec; pin: Vec; psa: Vec } {
  const th = (pinToPapAngleDeg(pinToPapIn, diameterIn) * Math.PI) / 180;
  const pap: Vec = [0, 0, 1];
  const pin: Vec = [Math.sin(th), 0, Math.cos(th)];
  const u: Vec = th > 1e-9 ? [-Math.cos(th), 0, Math.sin(th)] : [-1, 0, 0]; // tangent at the pin toward the PAP
  const w = cross(pin, u);
  const v = (valAngleDeg * Math.PI) / 180;
  const psa = norm(add(scale(u, Math.cos(v)), scale(w, hand * Math.sin(v))));
  return { pap, pin, psa };
}

/**
 * The spin axis's positions from release (the PAP) to the pins: the axis precesses about the pin (the low-RG axis)
 * at the pin-to-PAP angle — the torque-free motion of a body with two nearly equal moments of inertia (Euler's
 * equations; e.g. H. Goldstein, Classical Mechanics, the force-free motion of a symmetric top) — until it has moved
 * `flareIn` inches of arc from the PAP (the motion model's flare). Each axis position carries a track ring: the
 * circle of contact points at 90° + axis tilt from the axis (the contact is straight down; the axis is tilted up).
 */
function flareRings(
  g: { pap: Vec; pin: Vec },
  flareIn: number,
  tiltDeg: number,
  radiusIn: number,
  hand: 1 | -1,
  count: number,
): { axes: MapPoint[]; rings: MapPoint[][] } {
  const th = Math.acos(Math.max(-1, Math.min(1, dot(g.pap, g.pin))));
  const trackRad = Math.PI / 2 + (tiltDeg * Math.PI) / 180;
  const rings: MapPoint[][] = [];
  const axes: MapPoint[] = [];
  for (let k = 0; k < count; k++) {
    const delta = Math.min((flareIn / radiusIn) * (count > 1 ? k / (count - 1) : 0), 2 * th);
    const s2 = Math.sin(th) ** 2;
    const phi = s2 < 1e-12 ? 0 : Math.acos(Math.max(-1, Math.min(1, (Math.cos(delta) - Math.cos(th) ** 2) / s2)));
    const axis = rotate(g.pap, g.pin, hand * phi);
    axes.push(toMap(axis, radiusIn) ?? { x: 0, y: 0 });
    rings.push(
      circle(axis, trackRad, 96)
        .map((p) => toMap(p, radiusIn))
        .filter((p): p is MapPoint => p !== null),
    );
  }
  return { axes, rings };
}

/**
 * The layout lab: for one ball and bowler on one condition, each candidate layout's drawing (PAP, pin, mass bias and
 * the predicted track rings on a PAP-centred map of the ball, distances from the PAP true in inches) and its
 * predicted path (simulateShot with the pocket solver), side by side.
 *
 * Definition: the rings' spread is the ball-motion model's flare (integrateDelivery: the farthest the spin axis moved
 * over the cover), so it grows with the differential and with the drive ½·ΔI·ω·sin 2θ, largest at θ = 45° between
 * pin and PAP (3.34 in on an 8.5 in ball; rigid-body mechanics); the rings are drawn along the precession circle
 * about the pin (flareRings). The drilling angle is carried in the layout and used by the ranking's reaction; the
 * motion model places the mass bias by the VAL angle (the drilling angle stands in when no VAL angle is given).
 * Drilling itself belongs with a qualified pro-shop technician.
 *
 * @returns one entry per layout, in the order given.
 */
export function layoutLab(input: {
  ball: BallSpec;
  bowler: BowlerProfile;
  pattern: OilPattern;
  lane?: LaneSurface;
  layouts: { id: string; label: string; layout: BallLayout }[];
  rings?: number;
}): LayoutLabEntry[] {
  const fn = 'layoutLab';
  if (!Array.isArray(input?.layouts) || input.layouts.length === 0) throw new RangeError(`${fn}: give at least one layout`);
  const diameter = input.ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN;
  const radius = diameter / 2;
  const hand: 1 | -1 = input.bowler.hand === 'left' ? -1 : 1;
  const count = Math.max(2, Math.min(12, Math.round(input.rings ?? 6)));
  return input.layouts.map(({ id, label, layout }) => {
    const ball: BallSpec = { ...input.ball, layout };
    validateBallSpec(ball, fn);
    const p = simulateShot({ ball, bowler: input.bowler, pattern: input.pattern, lane: input.lane });
    const val = layout.valAngleDeg ?? layout.drillingAngleDeg ?? MOTION_CALIBRATION.defaultValAngleDeg;
    const g = layoutPoints(layout.pinToPapIn, val, diameter, hand);
    const map = (v: Vec) => toMap(v, radius) ?? { x: 0, y: 0 };
    return {
      id,
      label,
      layout,
      flareIn: p.flareIn,
      pap: map(g.pap),
      pin: map(g.pin),
      massBias: ball.intermediateDifferential > 0 || layout.valAngleDeg !== undefined ? map(g.psa) : null,
      ...flareRings(g, p.flareIn, input.bowler.axisTiltDeg, radius, hand, count),
      prediction: p,
    };
  });
}
