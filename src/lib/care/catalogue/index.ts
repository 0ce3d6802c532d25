export { cultivars, findCultivar, referenceCultivar, referenceCultivarSlug } from './cultivars';
export { climates, findClimate, referenceClimate, referenceClimateSlug } from './climates';
export {
	CULTIVAR_PARAMETER_BOUNDS,
	CULTIVAR_PARAMETER_NAMES,
	CULTIVAR_GROUPS,
	SIZE_CLASSES,
	FEEDING_SETTING_BOUNDS,
	type CultivarParameterName,
	type ParameterBound
} from './bounds';
