/**
 * Safety cautions attached to the steps they concern. Wording stays general on purpose: the plan
 * cannot know local law or a worker's training, so every set ends by deferring to both.
 */

export const CAUTION = {
	blades:
		'Knife, machete and spade work: keep blades sharp, wear gloves and sturdy shoes, cut away from yourself and keep others out of reach.',
	falling:
		'A cut pseudostem or bunch can fall: bunches weigh tens of kilograms, so work in twos (one supports the bunch) and keep everyone clear of the fall line.',
	sap: 'Banana sap stains clothes for good: wear old clothes and long sleeves.',
	fertilizer:
		'Fertilizer: wear gloves, keep granules off the stem, store the bag away from children and pets, and follow the label.',
	quarantine:
		'Moving plants, suckers or divisions can spread banana bunchy top and Fusarium wilt (Panama disease, TR4); many areas are regulated: check with the local agriculture department before moving plant material, and plant only clean material.',
	lifting: 'A mature mat and a division with its root ball are heavy: lift with your legs, or get help.',
	deference: 'Defer to local rules and licensed practice.'
} as const;

/** A caution set always closes with the deference line. */
export function cautions(...lines: string[]): string[] {
	return [...lines, CAUTION.deference];
}
