/** Public surface of the care-plan engine. Pure TypeScript: no database, no framework. */
export type * from './types';
export { computePlan, KIND_ORDER, GUIDE_FOR, DEFAULT_GENERATIONS } from './plan';
export { STEP_KINDS, UNITS, MONTH_NAMES, MONTH_ABBREVIATIONS, PLAN_BOUNDS, MONTHLY_MEAN_RANGE_TEXT } from './vocabulary';
export { PLANT_STAGES, PLANT_STAGE_IDS, STAGE_OF_STEP, stageLabel, stageOn, generationLabel, generationName, type PlantStage } from './stages';
export { PlanInputError, observedIssues, dateIssue, coolClimateIssue, BOUND_MESSAGES, MILESTONE_NAMES, type PlanInputIssue } from './validate';
export {
	cultivars,
	findCultivar,
	referenceCultivar,
	referenceCultivarSlug,
	climates,
	findClimate,
	referenceClimate,
	referenceClimateSlug,
	CULTIVAR_PARAMETER_BOUNDS,
	CULTIVAR_PARAMETER_NAMES,
	CULTIVAR_GROUPS,
	SIZE_CLASSES,
	FEEDING_SETTING_BOUNDS,
	type CultivarParameterName,
	type ParameterBound
} from './catalogue';
export { defaultFeeding, rationFor, canLabel } from './feeding';
export { toUnits, GRAMS_PER_POUND, GRAMS_PER_OUNCE, METRES_PER_FOOT } from './units';
export { nutrientsFor, elementalGrams, nitrogenRateKgPer100m2, P2O5_TO_P, K2O_TO_K } from './nutrients';
export {
	bananaDevelopmentRate,
	linearResponse,
	degreeDaysMethod1,
	degreeDaysMethod2,
	dailyMeanC,
	createThermalClock,
	thermalClockFor,
	annualThermalTime,
	BANANA_RESPONSE,
	type ThermalClock,
	type DevelopmentResponse
} from './thermal';
export { parseIsoDate, formatIsoDate, addMonths } from './dates';
export { CAUTION } from './cautions';
export * as model from './model';
