export { cultivars, findCultivar, referenceCultivar, referenceCultivarSlug } from './cultivars';
export { climates, findClimate, referenceClimate, referenceClimateSlug } from './climates';
