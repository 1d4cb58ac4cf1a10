/**
 * Tunnelwright's calculation core: pure TypeScript, SI units inside, units only at the edges.
 * No framework, DOM or database imports belong in this folder.
 */
export type { AirState } from './air-state';
export { CalcInputError } from './errors';
export type { Finding } from './findings';
export {
	SECTION_KINDS,
	MODEL_KINDS,
	DEFAULT_RE_INDEPENDENCE,
	BLOCKAGE_METHODS,
	BLOCKAGE_METHOD_LABELS,
	DEFAULT_BLOCKAGE_METHOD
} from './kinds';
export type { SectionKind, ModelKind, ReferenceBasis } from './kinds';
export {
	ISA,
	ISA_MIN_ALTITUDE_M,
	ISA_MAX_ALTITUDE_M,
	isaAtmosphere,
	sutherlandViscosity,
	speedOfSound,
	dryAirState,
	geopotentialAltitude
} from './atmosphere';
export {
	airState,
	saturationVapourPressure,
	waterVapourViscosity,
	humidAirViscosity,
	DEFAULT_CO2_MOLE_FRACTION
} from './humid-air';
export {
	reynoldsNumber,
	machNumber,
	dynamicPressure,
	pitotSpeed,
	INCOMPRESSIBLE_MACH_LIMIT
} from './flow';
export { similarity } from './similarity';
export type { Similarity, SimilarityInput } from './similarity';
export {
	blockage,
	sectionArea,
	DEFAULT_BLOCKAGE_LIMITS,
	DEFAULT_BODY_SHAPE_FACTOR,
	DEFAULT_TUNNEL_SHAPE_FACTOR,
	MASKELL_THETA_3D
} from './blockage';
export type {
	Blockage,
	BlockageInput,
	BlockageLimits,
	BlockageMethod,
	TestSection
} from './blockage';
export {
	convertUnit as convert,
	knownUnits,
	pascalsToMmH2O,
	READING_PRESSURE_UNITS,
	COLUMN_LENGTH_UNITS
} from './units';
export {
	manometerPressure,
	STANDARD_GRAVITY_MPS2,
	CONVENTIONAL_WATER_DENSITY_KGM3
} from './manometer';
export type { ManometerReading } from './manometer';
export { runLayout, locatePoint, pointAt, matrixRows } from './runs';
export type { PlannedRun, RunIdentity, RunLayout, PointPosition } from './runs';
export {
	expandMatrix,
	matrixSize,
	validatePlan,
	MAX_MATRIX_POINTS,
	MAX_POINTS_PER_PLANE,
	MATRIX_LIST_LIMITS
} from './matrix';
export type { MatrixPlan, MatrixRow, MeasurementPlane, Configuration } from './matrix';
export { uniformGrid } from './probe-grid';
export type { ProbeGrid, UniformGridSpec } from './probe-grid';
export { speedCondition, speedConditions } from './speed-conditions';
export type { SpeedCondition, FlowSetting } from './speed-conditions';
export { envelopeFindings, flowFindings, settingFindings } from './envelope';
export type { FacilityEnvelope } from './envelope';
export { estimateOccupancy } from './occupancy';
export type { FacilityTiming, Occupancy } from './occupancy';
export { propagateUncertainty } from './uncertainty';
export type {
	UncertainInput,
	UncertaintyBudget,
	InputCorrelation,
	PropagationOptions
} from './uncertainty';
export { pressureCoefficient, blockageCorrectedCp } from './coefficients';
export { meanCpUncertainty, cpDifferenceUncertainty } from './coefficient-uncertainty';
export type {
	MeanCpUncertaintyInput,
	CpDifferenceUncertaintyInput
} from './coefficient-uncertainty';
export { gridAverages, matchedDifference } from './grid';
export type { Grid, GridAverages, MatchedDifference } from './grid';
export { linearFit, meanWithTypeA } from './statistics';
export type { LinearFit, MeanWithTypeA } from './statistics';
export { wakeSurveyDrag } from './wake-drag';
export type { WakeSurvey, WakeSurveyDrag } from './wake-drag';
export { reynoldsSweep } from './reynolds-sweep';
export type { ReynoldsPoint, ReynoldsSweep } from './reynolds-sweep';
export { toSignificant } from './significant';
export {
	amountDifference,
	CHARGE_ITEMS,
	creditCharges,
	minorDigits,
	occupancyCost,
	occupancyTimeCharges,
	priceCharges,
	TIME_ITEMS,
	toMinorUnits
} from './pricing';
export type {
	ChargeItem,
	FacilityRates,
	PriceLine,
	PricedCharges,
	TimeCharge,
	TimeItem
} from './pricing';
