import type { FrictionField } from './frictionField';
import type { NewtonEulerKernel } from './newtonEuler';
import { bodySpin } from './bodyRotation';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

const split = K.filmSplit,
  wB = K.carriedFilmWeight;
/** ln of the share of the ring's oil kept per pass through contact. */
const keepPerPass = Math.log(1 - K.exchangeFraction);
const invTrack = 1 / (K.trackWidthIn * C.inchM);
const spin = new Float64Array(3);

/**
 * The spin axis's path through the ball during one delivery and the oil it carries: flare (how far the axis
 * migrated over the cover from its release position, from Euler's equations, not imposed) and, on an oil field
 * whose ball carries oil, the track ring — the circle of cover that touches the lane — which exchanges oil with
 * the lane on each pass through contact (toward filmSplit·h, exchangeFraction per pass), gives it up to the cover
 * with the cover's absorption time and is refreshed with dry cover as the axis migrates (a migration of one
 * trackWidthIn replaces the ring). The ring's rates are taken at the start and end of each step and the update
 * uses their mean (second order in h, like the rest of the step); the step's friction reads the ring at mid-step.
 *
 * Source: the model's oil-transfer assumptions (engine/motion/README.md) on rigid-body mechanics. Units: SI
 * state, µm of film, inches of flare. Edge cases: internal to integrateDelivery (its state is checked there).
 * Example: `new SpinAxisTrack(s, kernel, field)`, then `beforeStep` and `afterStep` around each RK4 step.
 */
export class SpinAxisTrack {
  private readonly carried: boolean;
  private readonly invAbsorbS: number;
  /** Carried film on the track, µm. */
  private ring = 0;
  /** Exchange rate per s, loss rate (flare and absorption) per s and the lane film under the ball at the step's start. */
  private exRate = 0;
  private lossRate: number;
  private laneFilm = 0;
  /** The spin axis in body axes now, and at release (the first track ring's pole). */
  private pbx = 0;
  private pby = 0;
  private pbz = 0;
  private readonly a0x: number;
  private readonly a0y: number;
  private readonly a0z: number;
  private flareCos = 1;

  constructor(s: Float64Array, k: NewtonEulerKernel, field: FrictionField) {
    this.carried = field.kind === 'oil' && field.carriedOil;
    this.invAbsorbS = Number.isFinite(field.absorptionTimeS) ? 1 / field.absorptionTimeS : 0;
    this.lossRate = this.invAbsorbS;
    if (this.carried) {
      this.laneFilm = k.gridAt(s[0], s[1]);
      this.exRate = (-keepPerPass * Math.sqrt(s[4] * s[4] + s[5] * s[5] + s[6] * s[6])) / (2 * Math.PI);
    }
    const nb = bodySpin(s, spin);
    if (nb > 0) {
      this.pbx = spin[0] / nb;
      this.pby = spin[1] / nb;
      this.pbz = spin[2] / nb;
    }
    this.a0x = this.pbx;
    this.a0y = this.pby;
    this.a0z = this.pbz;
  }

  /** Sets the kernel's carried film for a step of length h (the ring at mid-step). */
  beforeStep(k: NewtonEulerKernel, h: number): void {
    if (this.carried) {
      const h2 = h / 2;
      const tgt = split * this.laneFilm;
      k.carried = wB * (tgt + (this.ring - tgt) * Math.exp(-this.exRate * h2)) * Math.exp(-this.lossRate * h2);
    } else k.carried = 0;
  }

  /** After a step of length h: how far the spin axis moved through the body (chord ≈ arc), and the ring's oil. */
  afterStep(s: Float64Array, k: NewtonEulerKernel, h: number): void {
    const wmag = bodySpin(s, spin);
    if (!(wmag > 0)) return;
    const inv = 1 / wmag;
    const nx = spin[0] * inv,
      ny = spin[1] * inv,
      nz = spin[2] * inv;
    const ex = nx - this.pbx,
      ey = ny - this.pby,
      ez = nz - this.pbz;
    const dAxis = Math.sqrt(ex * ex + ey * ey + ez * ez);
    const c0 = nx * this.a0x + ny * this.a0y + nz * this.a0z;
    if (c0 < this.flareCos) this.flareCos = c0;
    this.pbx = nx;
    this.pby = ny;
    this.pbz = nz;
    if (this.carried) {
      // the track ring: passes through contact (one per revolution), fresh cover from flare, absorption
      const hLane = k.gridAt(s[0], s[1]);
      const ex1 = (-keepPerPass * wmag) / (2 * Math.PI);
      const tgt = split * 0.5 * (this.laneFilm + hLane);
      this.ring = tgt + (this.ring - tgt) * Math.exp(-0.5 * (this.exRate + ex1) * h);
      const fresh = k.R * dAxis * invTrack;
      const loss1 = (fresh < 1 ? -Math.log(1 - fresh) / h : Infinity) + this.invAbsorbS;
      this.ring *= Math.exp(-0.5 * (this.lossRate + loss1) * h);
      this.exRate = ex1;
      this.lossRate = loss1;
      this.laneFilm = hLane;
    }
  }

  /** Flare so far: the farthest the spin axis moved over the cover from its release position, inches of arc. */
  flareIn(radiusM: number): number {
    return (Math.acos(Math.max(-1, Math.min(1, this.flareCos))) * radiusM) / C.inchM;
  }
}
