/** The ball-motion model (engine second layer). Re-exports only. */
export { PHYSICAL_CONSTANTS } from './physicalConstants';
export { MOTION_CALIBRATION } from './motionCalibration';
export type { CoverCalibration } from './motionCalibration';
export { ballInertia } from './ballInertia';
export type { BallInertia } from './ballInertia';
export { coverFriction } from './coverFriction';
export type { CoverFriction } from './coverFriction';
export { laneOilMap } from './laneOilMap';
export type { LaneOilMap } from './laneOilMap';
export { uniformFrictionField, sampledFrictionField, oilFrictionField } from './frictionField';
export type { FrictionField } from './frictionField';
export { layoutOrientation } from './layoutOrientation';
export { releaseState, STATE, handSign } from './releaseState';
export { integrateDelivery } from './integrateDelivery';
export type { IntegrateOptions, DeliveryResult } from './integrateDelivery';
export { contactAngularMomentum } from './contactAngularMomentum';
export { kineticEnergy } from './kineticEnergy';
