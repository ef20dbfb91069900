import type { BallInertia } from './ballInertia';
import type { FrictionField } from './frictionField';
import { bilinear } from './bilinear';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** Fixed-shape parameter block of the right-hand side (monomorphic for the JIT). */
export class NewtonEulerKernel {
  m = 0;
  R = 0;
  g = C.g;
  eps2 = 0;
  i1 = 0;
  i2 = 0;
  i3 = 0;
  inv1 = 0;
  inv2 = 0;
  inv3 = 0;
  /** 0 uniform, 1 sampled μ grid, 2 oil film grid. */
  kind = 0;
  mu0 = 0;
  dMu = 0;
  hc = 1;
  /** The film the ball carries on its track at this step's middle, weighted (oil fields). */
  carried = 0;
  rows = 0;
  cols = 0;
  invRowM = 0;
  grid: Float64Array = new Float64Array(0);

  /** The kernel of one delivery: the ball's inertia, the friction field and the regularisation speed ε (m/s). */
  constructor(inertia: BallInertia, field: FrictionField, eps: number) {
    this.m = inertia.massKg;
    this.R = inertia.radiusM;
    this.eps2 = eps * eps;
    this.i1 = inertia.iLow;
    this.i2 = inertia.iHigh;
    this.i3 = inertia.iInt;
    this.inv1 = 1 / this.i1;
    this.inv2 = 1 / this.i2;
    this.inv3 = 1 / this.i3;
    this.kind = field.kind === 'uniform' ? 0 : field.kind === 'sampled' ? 1 : 2;
    this.mu0 = field.mu0;
    this.dMu = field.dMu;
    this.hc = field.filmScaleUm;
    this.rows = field.rows;
    this.cols = field.cols;
    this.grid = field.kind === 'oil' ? field.filmUm : field.grid;
    this.invRowM = 1 / (field.ftStep * C.footM);
  }

  /** The lane's grid value (μ or film, µm) at lane position (x, y), m. */
  gridAt(x: number, y: number): number {
    return bilinear(this.grid, this.rows, this.cols, this.invRowM, x, y);
  }
}

/**
 * Newton–Euler right-hand side d = ṡ of a delivery state s: regularised Coulomb friction at the contact point
 * F = −μ m g u/√(|u|²+ε²), torque r_c × F, Euler's equations in the body frame, q̇ = ½(0, ω) ⊗ q with the
 * rotation matrix built with the 2/|q|² factor (exact for the non-unit quaternions of the RK4 stages).
 * No allocation. μ is the field's: uniform, a sampled μ grid, or the oil film through the cover's
 * mixed-lubrication law, μ = μ₀ + Δμ·h_c/(h + carried + h_c).
 *
 * Source: rigid-body mechanics (Newton–Euler equations, Euler's equations, quaternion kinematics). Units: SI.
 * Edge cases: internal to integrateDelivery, which checks its inputs. Example: a ball rolling without slip on a
 * uniform field has d[2] ≈ 0 (u = 0 up to the ε regularisation).
 */
export function newtonEulerRhs(s: Float64Array, d: Float64Array, k: NewtonEulerKernel): void {
  const R = k.R;
  let mu: number;
  if (k.kind === 0) mu = k.mu0;
  else if (k.kind === 1) mu = bilinear(k.grid, k.rows, k.cols, k.invRowM, s[0], s[1]);
  else {
    const h = bilinear(k.grid, k.rows, k.cols, k.invRowM, s[0], s[1]) + k.carried;
    mu = k.mu0 + (k.dMu * k.hc) / (h + k.hc);
  }
  // the slip velocity of the contact point, u = v + ω × r_c
  const vx = s[2],
    vy = s[3];
  const ux = vx - R * s[5],
    uy = vy + R * s[4];
  const c = (-mu * k.g) / Math.sqrt(ux * ux + uy * uy + k.eps2);
  const ax = c * ux,
    ay = c * uy; // F/m
  const tx = R * k.m * ay,
    ty = -R * k.m * ax; // τ = r_c × F, τ_z = 0
  // the rotation matrix Q with the 2/|q|² factor: bodyRotation's, written out in locals because this runs four
  // times a step (through bodyRotation's array a whole delivery took about 5 % more CPU)
  const qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10];
  const sc = 2 / (qw * qw + qx * qx + qy * qy + qz * qz);
  const q00 = 1 - sc * (qy * qy + qz * qz),
    q01 = sc * (qx * qy - qw * qz),
    q02 = sc * (qx * qz + qw * qy);
  const q10 = sc * (qx * qy + qw * qz),
    q11 = 1 - sc * (qx * qx + qz * qz),
    q12 = sc * (qy * qz - qw * qx);
  const q20 = sc * (qx * qz - qw * qy),
    q21 = sc * (qy * qz + qw * qx),
    q22 = 1 - sc * (qx * qx + qy * qy);
  const wx = s[4],
    wy = s[5],
    wz = s[6];
  // ω and τ in body axes (Qᵀ), Euler's equations, back to lane axes (Q)
  const w1 = q00 * wx + q10 * wy + q20 * wz,
    w2 = q01 * wx + q11 * wy + q21 * wz,
    w3 = q02 * wx + q12 * wy + q22 * wz;
  const t1 = q00 * tx + q10 * ty,
    t2 = q01 * tx + q11 * ty,
    t3 = q02 * tx + q12 * ty;
  const dw1 = (t1 + (k.i2 - k.i3) * w2 * w3) * k.inv1;
  const dw2 = (t2 + (k.i3 - k.i1) * w3 * w1) * k.inv2;
  const dw3 = (t3 + (k.i1 - k.i2) * w1 * w2) * k.inv3;
  d[0] = vx;
  d[1] = vy;
  d[2] = ax;
  d[3] = ay;
  d[4] = q00 * dw1 + q01 * dw2 + q02 * dw3;
  d[5] = q10 * dw1 + q11 * dw2 + q12 * dw3;
  d[6] = q20 * dw1 + q21 * dw2 + q22 * dw3;
  d[7] = -0.5 * (wx * qx + wy * qy + wz * qz);
  d[8] = 0.5 * (wx * qw + wy * qz - wz * qy);
  d[9] = 0.5 * (wy * qw + wz * qx - wx * qz);
  d[10] = 0.5 * (wz * qw + wx * qy - wy * qx);
}

// RK4 stage buffers (reused between calls; a delivery is synchronous and its onStep callback must not start another).
const rkTmp = new Float64Array(11),
  rk1 = new Float64Array(11),
  rk2 = new Float64Array(11),
  rk3 = new Float64Array(11),
  rk4 = new Float64Array(11);

/**
 * One classical RK4 step of length h on the Newton–Euler state s (in place), then the quaternion renormalised.
 *
 * Source: the classical Runge–Kutta method (common practice). Units: s. Edge cases: internal, unchecked.
 * Example: `rk4Step(s, 0.006, kernel)` advances s by 6 ms.
 */
export function rk4Step(s: Float64Array, h: number, k: NewtonEulerKernel): void {
  const h2 = h / 2,
    h6 = h / 6;
  const tmp = rkTmp,
    k1 = rk1,
    k2 = rk2,
    k3 = rk3,
    k4 = rk4;
  newtonEulerRhs(s, k1, k);
  for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k1[i];
  newtonEulerRhs(tmp, k2, k);
  for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k2[i];
  newtonEulerRhs(tmp, k3, k);
  for (let i = 0; i < 11; i++) tmp[i] = s[i] + h * k3[i];
  newtonEulerRhs(tmp, k4, k);
  for (let i = 0; i < 11; i++) s[i] += h6 * (k1[i] + 2 * (k2[i] + k3[i]) + k4[i]);
  const qn = 1 / Math.sqrt(s[7] * s[7] + s[8] * s[8] + s[9] * s[9] + s[10] * s[10]);
  s[7] *= qn;
  s[8] *= qn;
  s[9] *= qn;
  s[10] *= qn;
}
