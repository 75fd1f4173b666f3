// The torque-plan engine's public API: pure functions, no I/O, usable on the server, in the
// browser and in tests. Other code imports from here only.
export { TorquePlanError } from './errors';
export {
  convertPressure,
  convertTorque,
  formatTorque,
  isPressureUnit,
  isTorqueUnit,
  PRESSURE_UNITS,
  TORQUE_UNITS,
  UNIT_LABELS,
  type Pressure,
  type PressureUnit,
  type Torque,
  type TorqueUnit,
} from './units';
export {
  handStartOrder,
  MAX_BOLTS,
  MIN_BOLTS,
  PUBLISHED_CROSS,
  spreadCross,
  tighteningSequence,
  type Pattern,
} from './sequence';
export { PRESSURE_TOLERANCE, pressureOffTarget, type PressureOff } from './pressure-check';
export { DEFAULT_FRACTIONS, passPlan, type PlannedPass } from './pass-plan';
export {
  chooseWrench,
  assertWrench,
  CYCLE_LIMIT,
  tolerancePct,
  verifyReading,
  type Wrench,
  type WrenchChoice,
} from './wrench';
export {
  axleMismatch,
  circumferenceAllowancePct,
  tireDiameter,
  type TireConstruction,
  type TireSize,
} from './tire';
export {
  arrowDirection,
  WHEEL_POSITIONS,
  type ArrowDirection,
  type WheelPosition,
} from './direction';
export { planTorque, type TorquePlan, type TorquePlanInput } from './plan';
export {
  isNearEnough,
  isRecentEnough,
  nearBand,
  verificationFor,
  type RecordedVerification,
  type VerificationPolicy,
  type VerificationVerdict,
} from './verification-policy';
export {
  BEAD_SEAT_CEILING_PSI,
  checkPlausibility,
  pressureLimitIn,
  RING_BOLT_FT_LB_RANGE,
  RUNNING_PSI_RANGE,
  SEAT_TO_RUNNING_RATIO,
  torqueLimitIn,
  wheelTargetError,
  type Plausibility,
  type PlausibilityField,
  type PlausibilityInput,
  type PlausibilityIssue,
} from './plausibility';
export {
  THREAD_CONDITION_LABELS,
  THREAD_CONDITION_UNSTATED,
  THREAD_CONDITIONS,
  threadConditionText,
  type ThreadCondition,
} from './thread-condition';
