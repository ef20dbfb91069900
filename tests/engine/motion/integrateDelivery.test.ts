import { describe, expect, it } from 'vitest';
import {
  ballInertia,
  contactAngularMomentum,
  integrateDelivery,
  kineticEnergy,
  releaseState,
  sampledFrictionField,
  STATE,
  uniformFrictionField,
} from '../../../engine/index';
import { asymmetricBall, isotropicBall, linePsi, MM_PER_BOARD, referenceBowler } from './fixtures';

const G = 9.80665;
const twoZone = (muDry = 0.2, oilFt = 40) => sampledFrictionField((_b, ft) => (ft < oilFt ? 0.04 : muDry), { ftStep: 0.01 });

/** A sliding, spin-free state at the foul line on board 20. */
function slidingState(v0: number, omegaY = 0): Float64Array {
  const s = new Float64Array(STATE.length);
  s[STATE.vx] = v0;
  s[STATE.wy] = omegaY;
  s[STATE.qw] = 1;
  return s;
}

describe('integrateDelivery — slide-to-roll on uniform friction (the sliding sphere: textbook mechanics)', () => {
  // Textbook result: d = (v0² − vf²)/(2μg), vf = v0·R²/(R² + k²)
  for (const rg of [2.46, 2.55, 2.65, 2.8]) {
    it(`m, RG ${rg} in, no spin, μ = 0.2: rolls after (v0²−vf²)/(2μg) within 2 cm and then moves at vf within 1e-5 m/s (regularised friction, ε = 0.03 m/s, blurs the roll point)`, () => {
      const ball = isotropicBall(rg);
      const I = ballInertia(ball);
      const k2 = (rg * 0.0254) ** 2,
        R2 = I.radiusM ** 2;
      const v0 = 8,
        vf = (v0 * R2) / (R2 + k2);
      const r = integrateDelivery(slidingState(v0), I, uniformFrictionField(0.2));
      expect(r.rollStartFt).not.toBeNull();
      expect(Math.abs((r.rollStartFt as number) * 0.3048 - (v0 * v0 - vf * vf) / (2 * 0.2 * G))).toBeLessThan(0.02);
      expect(Math.abs(r.speedAtPinsMph * 0.44704 - vf)).toBeLessThan(1e-5);
    });
  }

  it('m/s, uniform sphere k² = 0.4R², no spin: rolls at 5/7·v0 (a mechanics lecture note; the closed form) and the closed form’s row (s* 7.9912 m)', () => {
    const R = 4.25 * 0.0254;
    const ball = isotropicBall(Math.sqrt(0.4) * 4.25);
    const r = integrateDelivery(slidingState(8), ballInertia(ball), uniformFrictionField(0.2));
    expect(Math.abs(r.speedAtPinsMph * 0.44704 - (5 / 7) * 8)).toBeLessThan(1e-6);
    // production steps (up to MOTION_CALIBRATION.maxStepS while the ball slides fast) and regularised friction: ±1 cm
    expect(Math.abs((r.rollStartFt as number) * 0.3048 - 7.9912)).toBeLessThan(0.01);
    expect(R).toBeCloseTo(0.10795, 5);
  });

  // Closed-form rows of the sliding sphere (derived, uniform sphere, v0 = 8 m/s, μ = 0.2)
  const rows: [string, number, number, number][] = [
    ['backspin ω0 = −20 rad/s', -20, 9.6914, 5.0974],
    ['topspin ω0 = 40 rad/s', 40, 4.0088, 6.948],
    ['over-spin ω0 = 100 rad/s', 100, 3.4198, 8.7986],
  ];
  for (const [name, w0, sStar, vStar] of rows) {
    it(`m and m/s, uniform sphere, ${name}: rolls at s* = ${sStar} m (±1.5 cm) with v* = ${vStar} m/s (±1e-4)`, () => {
      const ball = isotropicBall(Math.sqrt(0.4) * 4.25);
      const r = integrateDelivery(slidingState(8, w0), ballInertia(ball), uniformFrictionField(0.2));
      // regularised friction (ε) and the production steps (up to MOTION_CALIBRATION.maxStepS while sliding fast)
      // blur the roll point by up to about a centimetre
      expect(Math.abs((r.rollStartFt as number) * 0.3048 - sStar)).toBeLessThan(0.015);
      expect(Math.abs(r.speedAtPinsMph * 0.44704 - vStar)).toBeLessThan(1e-4);
    });
  }

  it('ratio, max-diameter ball R = 4.2975 in, vf/v0 for RG 2.46/2.55/2.65/2.80 = 0.753/0.740/0.725/0.702 (textbook mechanics: v_f/v_0 = R²/(R² + k²))', () => {
    const expected: [number, number][] = [
      [2.46, 0.753],
      [2.55, 0.74],
      [2.65, 0.725],
      [2.8, 0.702],
    ];
    for (const [rg, ratio] of expected) {
      const ball = isotropicBall(rg, { diameterIn: 8.595 });
      const r = integrateDelivery(slidingState(8), ballInertia(ball), uniformFrictionField(0.2));
      expect(Math.abs((r.speedAtPinsMph * 0.44704) / 8 - ratio)).toBeLessThan(0.0005);
    }
  });
});

describe('integrateDelivery — hook deliveries on a two-zone lane (the two-zone closed form, derived after Frohlich 2004)', () => {
  // columns: case, rg (null = uniform sphere), v0, heading, rpm, rotation, oil ft, μ dry, x roll m, y pins mm, t pins s, heading at pins °, v roll m/s
  const table: [string, number | null, number, number, number, number, number, number, number, number, number, number, number][] = [
    ['A reference', 2.5, 8, 0, 300, 45, 40, 0.2, 15.601, 632.1, 2.4799, 5.203, 6.566],
    ['B uniform sphere', null, 8, 0, 300, 45, 40, 0.2, 16.18, 662.6, 2.4892, 5.926, 6.4104],
    ['C outward launch', 2.5, 8, -1.5, 300, 45, 40, 0.2, 15.606, 152.5, 2.4783, 3.703, 6.566],
    ['D high rev', 2.5, 8, -2, 450, 50, 40, 0.2, 15.694, 358.7, 2.4433, 6.152, 6.8243],
    ['E slow, low rev', 2.5, 7, -1, 250, 40, 40, 0.2, 14.107, 340.1, 2.8748, 3.495, 5.7558],
    ['F short oil', 2.5, 8, -1.5, 300, 45, 35, 0.2, 14.387, 227.6, 2.5011, 3.703, 6.566],
    ['H grippy dry', 2.5, 8, -1.5, 300, 45, 40, 0.3, 14.468, 188.5, 2.4892, 3.703, 6.566],
    ['I fast', 2.5, 9, -1.5, 350, 45, 40, 0.2, 17.116, 63.5, 2.1715, 3.877, 7.4137],
  ];
  for (const [name, rg, v0, psi, rpm, rot, oilFt, muDry, xRoll, yPins, tPins, headPins, vRoll] of table) {
    it(`mm/s/°, case ${name}: y at pins ${yPins} mm (±1 mm), t ${tPins} s (±1 ms), heading ${headPins}° (±0.01°), x roll ${xRoll} m (±2 cm: regularised friction blurs the roll point)`, () => {
      const ball = isotropicBall(rg ?? Math.sqrt(0.4) * 4.25);
      const bowler = referenceBowler({ speedMph: v0 / 0.44704, revRpm: rpm, axisRotationDeg: rot });
      const [laydown, target] = linePsi(psi);
      const r = integrateDelivery(releaseState(ball, bowler, laydown, target), ballInertia(ball), twoZone(muDry, oilFt));
      expect(Math.abs((r.entryBoard - 20) * MM_PER_BOARD - yPins)).toBeLessThan(1);
      expect(Math.abs(r.timeToPinsS - tPins)).toBeLessThan(1e-3);
      expect(Math.abs(r.entryAngleDeg - headPins)).toBeLessThan(0.01);
      expect(Math.abs((r.rollStartFt as number) * 0.3048 - xRoll)).toBeLessThan(0.02);
      expect(Math.abs(r.speedAtPinsMph * 0.44704 - vRoll)).toBeLessThan(1e-3);
    });
  }

  it('m and mm, breakpoints of cases C and D at x = 10.316/8.692 m and y = −139.2/−155.0 mm (the two-zone closed form’s breakpoints)', () => {
    const ball = isotropicBall(2.5);
    const cases: [number, number, number, number, number][] = [
      [-1.5, 300, 45, 10.316, -139.2],
      [-2, 450, 50, 8.692, -155.0],
    ];
    for (const [psi, rpm, rot, xb, yb] of cases) {
      const [laydown, target] = linePsi(psi);
      const r = integrateDelivery(
        releaseState(ball, referenceBowler({ revRpm: rpm, axisRotationDeg: rot }), laydown, target),
        ballInertia(ball),
        twoZone(),
      );
      expect(Math.abs(r.breakpointFt * 0.3048 - xb)).toBeLessThan(0.005);
      expect(Math.abs((r.breakpointBoard - 20) * MM_PER_BOARD - yb)).toBeLessThan(0.2);
    }
  });
});

describe('integrateDelivery — invariants (rigid-body mechanics: the angular momentum about the contact point, energy, invariants, mirror symmetry)', () => {
  it('kg·m²/s, asymmetric ball on the two-zone lane: L_P about the contact point is conserved in all components to 1e-6 relative at a 6 ms fixed step, 5e-5 at the production steps', () => {
    for (const [ball, bowler] of [
      [asymmetricBall(), referenceBowler()],
      [
        asymmetricBall({ layout: { pinToPapIn: 5.5, valAngleDeg: 20 } }),
        referenceBowler({ revRpm: 480, axisRotationDeg: 70, axisTiltDeg: 25 }),
      ],
      [isotropicBall(2.46), referenceBowler({ hand: 'left' })],
    ] as const) {
      const I = ballInertia(ball);
      const s0 = releaseState(ball, bowler, 25, 12);
      const L0 = contactAngularMomentum(s0, I);
      const n0 = Math.hypot(...L0);
      for (const [options, tol] of [
        [{ stepS: 0.006 }, 1e-6],
        [{}, 5e-5],
      ] as const) {
        let maxDev = 0;
        integrateDelivery(s0, I, twoZone(), {
          ...options,
          onStep: (_t, s) => {
            const L = contactAngularMomentum(s, I);
            maxDev = Math.max(maxDev, Math.hypot(L[0] - L0[0], L[1] - L0[1], L[2] - L0[2]) / n0);
          },
        });
        expect(maxDev).toBeLessThan(tol);
      }
    }
  });

  it('J, asymmetric ball, 0–500 rpm and 0–90° rotation on the two-zone lane: kinetic energy never rises by more than 1e-9 J per step (the energy balance of sliding friction)', () => {
    const ball = asymmetricBall();
    const I = ballInertia(ball);
    for (const rpm of [0, 150, 300, 500]) {
      for (const rot of [0, 45, 90]) {
        const s0 = releaseState(ball, referenceBowler({ revRpm: rpm, axisRotationDeg: rot }), 20, 15);
        let prev = kineticEnergy(s0, I),
          rise = 0;
        integrateDelivery(s0, I, twoZone(), {
          onStep: (_t, s) => {
            const e = kineticEnergy(s, I);
            rise = Math.max(rise, e - prev);
            prev = e;
          },
        });
        expect(rise).toBeLessThan(1e-9);
      }
    }
  });

  it('mph, isotropic ball with forward slip (rev surface speed below ball speed), 0–500 rpm, 0–90°: speed never increases along the path (the isotropic sliding sphere: |v| falls while sliding, constant rolling)', () => {
    const ball = isotropicBall(2.5);
    const I = ballInertia(ball);
    for (const rpm of [0, 150, 300, 500]) {
      for (const rot of [0, 45, 90]) {
        const r = integrateDelivery(releaseState(ball, referenceBowler({ revRpm: rpm, axisRotationDeg: rot }), 20, 17), I, twoZone());
        expect(r.sampleCount).toBeGreaterThan(10);
        for (let i = 1; i < r.sampleCount; i++) expect(r.sampleSpeedMph[i]).toBeLessThanOrEqual(r.sampleSpeedMph[i - 1] + 1e-9);
      }
    }
  });

  it('mph, asymmetric ball: speed falls while sliding; once rolling it only oscillates (the Chaplygin rolling ball) by under 0.05 mph per foot', () => {
    const ball = asymmetricBall();
    const I = ballInertia(ball);
    for (const rpm of [150, 300, 500]) {
      const r = integrateDelivery(releaseState(ball, referenceBowler({ revRpm: rpm }), 20, 17), I, twoZone());
      for (let i = 1; i < r.sampleCount; i++) expect(r.sampleSpeedMph[i]).toBeLessThanOrEqual(r.sampleSpeedMph[i - 1] + 0.05);
      expect(r.speedAtPinsMph).toBeLessThan(r.sampleSpeedMph[0] - 1);
    }
  });

  it('m/s, isotropic ball released already rolling (v = Rω × ẑ, the rolling condition): never slides, rollStartFt = 0 and speed constant', () => {
    const ball = isotropicBall(2.5);
    const I = ballInertia(ball);
    const s = new Float64Array(STATE.length);
    s[STATE.vx] = 7;
    s[STATE.vy] = 0.3;
    s[STATE.wy] = 7 / I.radiusM;
    s[STATE.wx] = -0.3 / I.radiusM;
    s[STATE.wz] = 12;
    s[STATE.qw] = 1;
    let maxSlip = 0;
    const r = integrateDelivery(s, I, twoZone(), {
      onStep: (_t, x) => {
        maxSlip = Math.max(maxSlip, Math.hypot(x[2] - I.radiusM * x[5], x[3] + I.radiusM * x[4]));
      },
    });
    expect(r.rollStartFt).toBe(0);
    expect(maxSlip).toBeLessThan(1e-9);
    expect(Math.abs(r.speedAtPinsMph * 0.44704 - Math.hypot(7, 0.3))).toBeLessThan(1e-9);
  });

  it('m/s, asymmetric ball released rolling on a dry lane (μ = 0.2): no sliding phase, only micro-slip below 0.15 m/s (the Chaplygin rolling ball: the friction it needs can exceed μN)', () => {
    const ball = asymmetricBall();
    const I = ballInertia(ball);
    const s = releaseState(ball, referenceBowler(), 20, 20);
    s[STATE.wx] = 0;
    s[STATE.wy] = s[STATE.vx] / I.radiusM;
    s[STATE.vy] = 0;
    let maxSlip = 0;
    const r = integrateDelivery(s, I, uniformFrictionField(0.2), {
      onStep: (_t, x) => {
        maxSlip = Math.max(maxSlip, Math.hypot(x[2] - I.radiusM * x[5], x[3] + I.radiusM * x[4]));
      },
    });
    expect(r.rollStartFt).toBe(0);
    expect(maxSlip).toBeLessThan(0.15);
  });

  it('mm, no spin, any core and orientation: the path stays straight within 1 mm (a rigid-body prototype drifted < 0.2 mm; ours drifts 0.3–0.8 mm) and exactly when a principal axis is along ŷ (a rigid-body invariant)', () => {
    const ball = asymmetricBall();
    const I = ballInertia(ball);
    for (const [pin, val] of [
      [1, 10],
      [3.4, 50],
      [5, 80],
      [2.2, 130],
    ]) {
      const b = asymmetricBall({ layout: { pinToPapIn: pin, valAngleDeg: val } });
      const s0 = releaseState(b, referenceBowler({ revRpm: 0 }), 20, 20);
      const r = integrateDelivery(s0, I, twoZone());
      for (let i = 0; i < r.sampleCount; i++) expect(Math.abs((r.sampleBoard[i] - 20) * MM_PER_BOARD)).toBeLessThan(1);
    }
    const s = slidingState(8);
    const r = integrateDelivery(s, I, twoZone());
    for (let i = 0; i < r.sampleCount; i++) expect(r.sampleBoard[i]).toBe(20);
  });

  it('boards, asymmetric ball: a left-hander on the mirrored lane gets the same hand-relative path as the right-hander (mirror symmetry) to 1e-9 boards', () => {
    const ball = asymmetricBall();
    const I = ballInertia(ball);
    // a lane that is not symmetric about board 20: dry outside board 8 (pattern boards from the right)
    const fieldR = sampledFrictionField((b, ft) => (ft < 38 && b > 8 ? 0.04 : 0.18), { ftStep: 0.25 });
    const fieldL = sampledFrictionField((b, ft) => (ft < 38 && 40 - b > 8 ? 0.04 : 0.18), { ftStep: 0.25 });
    const rR = integrateDelivery(releaseState(ball, referenceBowler({ hand: 'right' }), 23, 11), I, fieldR, { hand: 1 });
    const rL = integrateDelivery(releaseState(ball, referenceBowler({ hand: 'left' }), 23, 11), I, fieldL, { hand: -1 });
    expect(rL.sampleCount).toBe(rR.sampleCount);
    for (let i = 0; i < rR.sampleCount; i++) {
      expect(Math.abs(rL.sampleBoard[i] - rR.sampleBoard[i])).toBeLessThan(1e-9);
      expect(Math.abs(rL.sampleSpeedMph[i] - rR.sampleSpeedMph[i])).toBeLessThan(1e-9);
    }
    expect(Math.abs(rL.entryAngleDeg - rR.entryAngleDeg)).toBeLessThan(1e-9);
  });

  it('m/s, ball released rolling on a frictionless lane at the production steps: it keeps its speed and line (Newton’s first law) and every sample is a number', () => {
    const I = ballInertia(isotropicBall(2.5));
    const v0 = 25 * I.radiusM;
    const s = slidingState(v0, 25); // rolling: ω_y R = v exactly, so the slip speed is 0
    const r = integrateDelivery(s, I, uniformFrictionField(0));
    expect(r.sampleCount).toBeGreaterThan(10);
    for (let i = 0; i < r.sampleCount; i++) expect(Math.abs(r.sampleBoard[i] - r.sampleBoard[0])).toBeLessThan(1e-9);
    expect(r.reachedPins).toBe(true);
    expect(Math.abs(r.speedAtPinsMph * 0.44704 - v0)).toBeLessThan(1e-9);
    expect(Math.abs(r.entryAngleDeg)).toBeLessThan(1e-9);
  });

  it('rad/s, symmetric core 2.50/2.55 in on a frictionless lane, 300 rpm, pin 60° from the axis: ω precesses about the pin at 0.609959 rad/s (Euler’s equations: Ω = (1 − k_L²/k_H²)|ω| cos β)', () => {
    const ball = isotropicBall(2.5, { differential: 0.05, layout: { pinToPapIn: ((60 * Math.PI) / 180) * 4.25 } });
    const I = ballInertia(ball);
    const s0 = releaseState(ball, referenceBowler({ axisRotationDeg: 45, axisTiltDeg: 15 }), 20, 20);
    const body = (s: Float64Array): [number, number, number] => {
      const [qw, qx, qy, qz] = [s[7], s[8], s[9], s[10]];
      const wx = s[4],
        wy = s[5],
        wz = s[6];
      const q00 = 1 - 2 * (qy * qy + qz * qz),
        q10 = 2 * (qx * qy + qw * qz),
        q20 = 2 * (qx * qz - qw * qy);
      const q01 = 2 * (qx * qy - qw * qz),
        q11 = 1 - 2 * (qx * qx + qz * qz),
        q21 = 2 * (qy * qz + qw * qx);
      const q02 = 2 * (qx * qz + qw * qy),
        q12 = 2 * (qy * qz - qw * qx),
        q22 = 1 - 2 * (qx * qx + qy * qy);
      return [q00 * wx + q10 * wy + q20 * wz, q01 * wx + q11 * wy + q21 * wz, q02 * wx + q12 * wy + q22 * wz];
    };
    const w0 = body(s0);
    let unwrapped = 0,
      last = Math.atan2(w0[2], w0[1]),
      tEnd = 0,
      w1Dev = 0;
    integrateDelivery(s0, I, uniformFrictionField(0), {
      stepS: 0.001,
      maxTimeS: 2,
      stopFt: 200,
      onStep: (t, s) => {
        const w = body(s);
        const a = Math.atan2(w[2], w[1]);
        let d = a - last;
        if (d > Math.PI) d -= 2 * Math.PI;
        if (d < -Math.PI) d += 2 * Math.PI;
        unwrapped += d;
        last = a;
        tEnd = t;
        w1Dev = Math.max(w1Dev, Math.abs(w[0] - w0[0]));
      },
    });
    expect(Math.abs(Math.abs(unwrapped) / tEnd - 0.609959)).toBeLessThan(1e-5);
    expect(w1Dev).toBeLessThan(1e-7); // ω₁ constant (rigid-body invariant)
  });
});

// engine/README.md's invalid-input policy for the kernel's building blocks: the shape of every input is checked
// first (scalars and lengths), and the message names the function called.
describe('integrateDelivery and the invariants — malformed input', () => {
  const ball = asymmetricBall();
  const s0 = releaseState(ball, referenceBowler(), 20, 12);
  const inertia = ballInertia(ball);
  const field = uniformFrictionField(0.2);

  it('refuses a malformed inertia, field, hand or state with the function’s name first', () => {
    expect(() => integrateDelivery(s0, { ...inertia, iLow: -1 }, field)).toThrow(/^integrateDelivery: inertia.iLow must be in/);
    expect(() => integrateDelivery(s0, inertia, { ...field, kind: 'wet' as 'oil' })).toThrow(TypeError);
    expect(() => integrateDelivery(s0, inertia, { ...field, kind: 'sampled' })).toThrow(/^integrateDelivery: field.rows must be/);
    expect(() => integrateDelivery(s0, inertia, field, { hand: 2 as 1 })).toThrow(/^integrateDelivery: hand must be 1 or -1/);
    const zeroQ = Float64Array.from(s0).fill(0, STATE.qw);
    expect(() => integrateDelivery(zeroQ, inertia, field)).toThrow(RangeError);
    expect(() => kineticEnergy(new Float64Array(3), inertia)).toThrow(/^kineticEnergy: state must be a Float64Array of length 11/);
    expect(() => contactAngularMomentum(zeroQ, inertia)).toThrow(/^contactAngularMomentum: state's orientation quaternion is zero/);
  });

  it('passes a valid state through: sliding friction lowers the kinetic energy (energy balance of sliding friction)', () => {
    const r = integrateDelivery(s0, inertia, field);
    expect(kineticEnergy(r.finalState, inertia)).toBeLessThan(kineticEnergy(s0, inertia));
    expect(contactAngularMomentum(s0, inertia).every(Number.isFinite)).toBe(true);
  });
});
