import type { DeliveryResult } from './deliveryResult';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

const invBw = 1 / C.boardWidthM,
  ftM = C.footM,
  half = C.laneHalfWidthM,
  mph = 1 / C.mphMs;

/**
 * What a delivery's integration records between its steps, hand-relative: the per-foot samples, the slip events
 * (roll start, end of skid), the breakpoint, the gutter and the entry at the stop distance, and the result they
 * make (integrateDelivery's definitions). Positions between two steps are interpolated linearly in the step.
 *
 * Source: Lanewright's definitions of the reported quantities (integrateDelivery's doc comment). Units: SI state
 * in, feet / boards / mph / degrees / seconds out. Edge cases: internal to integrateDelivery, which checks its
 * inputs. Example: `const rec = new DeliveryRecorder(s, 1, 60, R, tol)`, then `rec.afterStep(…)` after each step
 * until it returns true, then `rec.result(…)`.
 */
export class DeliveryRecorder {
  private readonly stopM: number;
  private readonly maxSamples: number;
  private readonly sampleFt: Float64Array;
  private readonly sampleBoard: Float64Array;
  private readonly sampleSpeed: Float64Array;
  private ns = 0;
  private nextFoot: number;
  private readonly skidU: number;
  private rollStartFt: number | null;
  private skidFt: number;
  /** The slip speed |u| after the last step, m/s (the step size grows with it). */
  uPrev: number;
  private bpY: number;
  private bpX: number;
  private gutter: boolean;
  private gutterFt: number | null;
  private reached = false;
  private entryBoard = NaN;
  private entryAngle = NaN;
  private tPins = NaN;
  private vPins = NaN;

  constructor(
    s: Float64Array,
    private readonly hand: 1 | -1,
    private readonly stopFt: number,
    private readonly R: number,
    /** The slip speed below which the ball rolls, m/s. */
    private readonly tol: number,
  ) {
    this.stopM = stopFt * ftM;
    this.maxSamples = Math.floor(stopFt) + 2;
    this.sampleFt = new Float64Array(this.maxSamples);
    this.sampleBoard = new Float64Array(this.maxSamples);
    this.sampleSpeed = new Float64Array(this.maxSamples);
    this.sampleFt[0] = s[0] / ftM;
    this.sampleBoard[0] = this.toBoard(s[1]);
    this.sampleSpeed[0] = Math.hypot(s[2], s[3]) * mph;
    this.ns = 1;
    this.nextFoot = Math.floor(s[0] / ftM) + 1;
    const u0 = this.slip(s);
    this.rollStartFt = u0 <= tol ? s[0] / ftM : null;
    this.skidU = (1 - K.skidSlipDrop) * u0;
    this.skidFt = u0 <= tol ? s[0] / ftM : NaN;
    this.uPrev = u0;
    this.bpY = hand * s[1];
    this.bpX = s[0];
    this.gutter = Math.abs(s[1]) > half;
    this.gutterFt = this.gutter ? s[0] / ftM : null;
  }

  private toBoard(y: number): number {
    return C.centreBoard + this.hand * y * invBw;
  }

  /** The slip speed |u| of the contact point, u = v + ω × r_c, m/s. */
  private slip(s: Float64Array): number {
    const ax = s[2] - this.R * s[5],
      ay = s[3] + this.R * s[4];
    return Math.sqrt(ax * ax + ay * ay);
  }

  /** Adds a sample at fraction f of the step from (x0, y0, vx0, vy0) to the state s. */
  private sample(ft: number, f: number, s: Float64Array, y0: number, vx0: number, vy0: number): void {
    this.sampleFt[this.ns] = ft;
    this.sampleBoard[this.ns] = this.toBoard(y0 + f * (s[1] - y0));
    this.sampleSpeed[this.ns] = Math.hypot(vx0 + f * (s[2] - vx0), vy0 + f * (s[3] - vy0)) * mph;
    this.ns++;
  }

  /**
   * Records the step of length h that ended at time t in state s and started at (x0, y0) with velocity
   * (vx0, vy0); true when the delivery is over (the stop distance reached, or the ball stalled).
   */
  afterStep(s: Float64Array, x0: number, y0: number, vx0: number, vy0: number, t: number, h: number): boolean {
    const hand = this.hand,
      stopM = this.stopM;
    const x1 = s[0],
      y1 = s[1];
    const dx = x1 - x0;
    // slip events
    const u1 = this.slip(s);
    const uPrev = this.uPrev;
    if (Number.isNaN(this.skidFt) && u1 <= this.skidU) {
      const f = uPrev > u1 ? (uPrev - this.skidU) / (uPrev - u1) : 1;
      this.skidFt = (x0 + f * dx) / ftM;
    }
    if (this.rollStartFt === null && u1 <= this.tol) {
      const rate = (uPrev - u1) / h;
      const tz = rate > 0 ? Math.min(u1 / rate, 0.02) : 0;
      this.rollStartFt = (x1 + s[2] * tz) / ftM;
    }
    this.uPrev = u1;
    // breakpoint (hand-relative lateral minimum)
    if (x1 <= stopM) {
      const yh1 = hand * y1;
      const vh0 = hand * vy0,
        vh1 = hand * s[3];
      if (vh0 < 0 && vh1 >= 0) {
        const tau = (vh0 / (vh0 - vh1)) * h;
        const yb = hand * y0 + 0.5 * vh0 * tau;
        if (yb < this.bpY) {
          this.bpY = yb;
          this.bpX = x0 + vx0 * tau;
        }
      }
      if (yh1 < this.bpY) {
        this.bpY = yh1;
        this.bpX = x1;
      }
    }
    // gutter
    if (!this.gutter && Math.abs(y1) > half && x1 <= stopM) {
      this.gutter = true;
      const f = (half - Math.abs(y0)) / (Math.abs(y1) - Math.abs(y0));
      this.gutterFt = (x0 + f * dx) / ftM;
      if (this.ns < this.maxSamples) this.sample(this.gutterFt, f, s, y0, vx0, vy0);
    }
    // per-foot samples
    while (!this.gutter && this.nextFoot <= this.stopFt && x1 >= this.nextFoot * ftM && dx > 0) {
      this.sample(this.nextFoot, (this.nextFoot * ftM - x0) / dx, s, y0, vx0, vy0);
      this.nextFoot++;
    }
    if (x1 >= stopM) {
      const f = (stopM - x0) / dx;
      const vxe = vx0 + f * (s[2] - vx0),
        vye = vy0 + f * (s[3] - vy0);
      this.entryBoard = this.toBoard(y0 + f * (y1 - y0));
      this.entryAngle = (Math.atan2(hand * vye, vxe) * 180) / Math.PI;
      this.tPins = t - h + f * h;
      this.vPins = Math.hypot(vxe, vye) * mph;
      this.reached = true;
      const ns = this.ns;
      if (!this.gutter && ns < this.maxSamples && this.sampleFt[ns - 1] < this.stopFt - 1e-9) {
        this.sampleFt[ns] = this.stopFt;
        this.sampleBoard[ns] = this.entryBoard;
        this.sampleSpeed[ns] = this.vPins;
        this.ns++;
      }
      return true;
    }
    return s[2] <= 0; // stalled or rolling back
  }

  /** The delivery's result once it is over at time t in state s (its last position when it never reached the pins). */
  result(s: Float64Array, t: number, steps: number, flareIn: number): DeliveryResult {
    const hand = this.hand;
    if (!this.reached) {
      this.entryBoard = this.toBoard(s[1]);
      this.entryAngle = (Math.atan2(hand * s[3], s[2]) * 180) / Math.PI;
      this.tPins = t;
      this.vPins = Math.hypot(s[2], s[3]) * mph;
    }
    const breakpointFt = this.bpX / ftM;
    let skidFt = this.skidFt;
    if (Number.isNaN(skidFt)) skidFt = (this.reached ? this.stopM : s[0]) / ftM;
    // the skid ends where the ball starts to hook: never after its breakpoint (when it has one past the release)
    if (breakpointFt > 0.5 && skidFt > breakpointFt) skidFt = breakpointFt;
    return {
      sampleFt: this.sampleFt,
      sampleBoard: this.sampleBoard,
      sampleSpeedMph: this.sampleSpeed,
      sampleCount: this.ns,
      rollStartFt: this.rollStartFt,
      skidFt,
      breakpointFt,
      breakpointBoard: C.centreBoard + this.bpY * invBw,
      entryBoard: this.entryBoard,
      entryAngleDeg: this.entryAngle,
      timeToPinsS: this.tPins,
      speedAtPinsMph: this.vPins,
      reachedPins: this.reached,
      gutter: this.gutter,
      gutterFt: this.gutterFt,
      flareIn,
      steps,
      finalState: s,
    };
  }
}
