/**
 * The physics core's public face. Pure TypeScript: no DOM, storage, network or Node APIs.
 * SI inside; every field that leaves the core carries its unit in its name.
 */

// The analysis of a series: used by the screens and the office command.
export { analyzeSeries, DEFAULT_MONTE_CARLO_DRAWS, CREEPING_FLOW_REYNOLDS } from './analyzeSeries';
export { validateAnalysisRequest, MARK_LIMITS } from './validateAnalysisRequest';
// Its named stages (the planner evaluates many drop sets on one setup).
export { prepareSeries, type PreparedSeries } from './analyzeSeries';
export { prepareSetup, cdFromDragConstant, dragConstantFromCd, type SeriesSetup } from './seriesSetup';
export { groupDrops, type DropGroups } from './dropGroups';
export { fitSeries, type SeriesFit } from './seriesFit';
export { seriesScatter, checkNotFasterThanFreeFall, type SeriesScatter } from './seriesScatter';
export { budgetInputs, type BudgetInputs } from './budgetInputs';
export { seriesBudget, type SeriesBudget } from './seriesBudget';
export { ownDragCoefficient, ownScaledSphereDragCoefficient, dropDragCoefficients, type DropDragCoefficients, type ScaledSphereLaw } from './dropDragCoefficient';
export { fallBodyOf, sphereScaleBodyOf } from './fallBodyOf';
export type {
  AnalysisRequest,
  AnalysisResult,
  AnalysisOptions,
  BudgetRow,
  DropInput,
  DropMark,
  DropResult,
  HeightResult,
  TimingInput,
  UncertaintyInput,
} from './analysisTypes';
export { PhysicsInputError, type PhysicsInputErrorCode } from './physicsInputError';
export type { PhysicsWarning } from './physicsWarning';

// Planning a test.
export { planDrop, type DropPlan, type DropPlanRequest, type DropAtHeight } from './planDrop';

// Air.
export { airProperties, AIR_LIMITS, CIPM_VALID_RANGE, type AirInput, type AirProperties, type PressureReference } from './airProperties';
export {
  moistAirDensity,
  compressibilityFactor,
  dryAirMolarMass,
  vapourMoleFractionFromRelativeHumidity,
  vapourMoleFractionFromDewPoint,
} from './moistAirDensity';
export { saturationVapourPressure, enhancementFactor } from './saturationVapourPressure';
export { stationPressureFromSeaLevel, seaLevelPressureFromStation, standardAtmosphereDensity } from './standardAtmosphere';
export { airViscosity } from './airViscosity';
export { speedOfSound } from './speedOfSound';

// Gravity.
export { normalGravity, localGravity, type SiteInput, type SiteGravity } from './normalGravity';

// Specimens.
export { checkSpecimen, geometryFromDimensions, SHAPE_DIMENSIONS, type SpecimenInput, type SpecimenShape, type SpecimenGeometry } from './specimenGeometry';
export { spheroidAddedMassCoefficient, equivalentSpheroidAddedMassCoefficient } from './addedMassCoefficient';

// The fall.
export {
  fallParameters,
  fallTime,
  fallDistance,
  fallSpeedAtTime,
  fallSpeedAtHeight,
  timeBetweenHeights,
  terminalVelocity,
  distanceToTerminalFraction,
  type FallBody,
  type FallParameters,
} from './fallModel';
export { fallWithVariableDrag, type VariableDragBody, type VariableDragFall } from './fallWithVariableDrag';
export { integrateDormandPrince, type OdeRightHandSide, type DormandPrinceOptions, type DormandPrinceResult } from './integrateDormandPrince';
export { morrisonSphereDragCoefficient, MORRISON_VALID_MAX_REYNOLDS } from './sphereDragCoefficient';
export {
  standardSphereDragCoefficient,
  STANDARD_SPHERE_DRAG_VALID_MAX_REYNOLDS,
  STANDARD_SPHERE_DRAG_RELATIVE_UNCERTAINTY,
  standardSphereDragRelativeUncertainty,
  DRAG_CRISIS_REYNOLDS,
} from './standardSphereDrag';
export { dragCrisisWarning } from './dragCrisisWarning';
export { TIMING_METHOD_DEFAULTS, TIMING_METHODS, ROLLING_SHUTTER_STANDARD_UNCERTAINTY_S, type TimingMethod, type TimingMethodDefaults } from './timingMethodDefaults';
export { defaultAddedMassUncertainty, ADDED_MASS_RELATIVE_UNCERTAINTY, CUSTOM_ADDED_MASS_UNCERTAINTY } from './addedMassCoefficient';

// Drag from times.
export { dragCoefficientFromTime } from './dragCoefficientFromTime';
export { fitDragConstant, type DragFit, type DragFitStatus } from './fitDragConstant';

// Statistics.
export { mean, standardDeviation, standardError, seriesStatistics, type SeriesStatistics } from './seriesStatistics';
export { studentTQuantile, studentTCdf, studentTDensity } from './studentT';
export { grubbsTest, grubbsCriticalValue, type GrubbsResult } from './grubbsTest';
export { createRandom, DEFAULT_SEED, type RandomSource } from './createRandom';
