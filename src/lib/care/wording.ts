/**
 * The English wording of every step: titles, explanations and the cautions each carries. One
 * module, so a step reads the same on every page, in the calendar and in e-mail, and the
 * engine's timing code carries no prose.
 */
import type { Cultivar, Units } from './types';
import { CAUTION, cautions } from './cautions';
import { generationLabel, generationName } from './stages';
import { lengthPhrase, massPhrase, temperaturePhrase } from './units';
import { MONTH_NAMES } from './vocabulary';

export interface StepText {
	title: string;
	detail: string;
	cautions?: string[];
}

export function plantingText(cultivar: Cultivar): StepText {
	return {
		title: `Plant your ${cultivar.name}`,
		detail:
			'Dig the hole, set the plant at the same depth it grew in the pot, and backfill with the soil that came out of the hole. ' +
			'Choose full sun. Water so the soil stays moist to the touch, never waterlogged.',
		cautions: cautions(CAUTION.quarantine, CAUTION.lifting)
	};
}

export function followersText(generation: number): StepText {
	return {
		title: `Followers appear at the base of ${generationName(generation)}`,
		detail:
			'One or two suckers show at about six months of age. Keep sword suckers (narrow, sword-shaped leaves on a broad base): ' +
			'they grow into strong bearing plants. Broad-leaved water suckers are weakly attached and bear poorly: remove them.',
		cautions: cautions(CAUTION.blades, CAUTION.sap)
	};
}

export function thinningText(generation: number): StepText {
	return {
		title: 'Thin the mat',
		detail:
			`Around ${generationName(generation)}, keep at most four plants at staggered sizes, from a new shoot to the bearing plant, so one bunch follows another. ` +
			'Cut surplus suckers at ground level and dig out their growing point. Commercial growers keep only two per mat for bigger bunches.',
		cautions: cautions(CAUTION.blades, CAUTION.sap)
	};
}

export function divisionText(units: Units): StepText {
	return {
		title: 'Divide off a fifth plant',
		detail:
			`If the mat has a fifth plant that has reached about waist height (${lengthPhrase(1, 3, units)}), dig the planting hole first, ` +
			'then cut the sucker from the mother with a sharp spade, lift it with its roots and replant it straight away. ' +
			'The division becomes a new plant with its own care plan.',
		cautions: cautions(CAUTION.blades, CAUTION.lifting, CAUTION.quarantine)
	};
}

export function flagLeafText(generation: number): StepText {
	return {
		title: `Flag leaf on ${generationName(generation)}`,
		detail: 'A short, stiff, upright leaf comes out last, just before the flower: the bunch is on its way.'
	};
}

export function shootingText(generation: number, cultivar: Cultivar): StepText {
	return {
		title: `${generationLabel(generation)} flowers (shooting)`,
		detail:
			`The flower stalk pushes out of the top, usually after ${cultivar.leavesToShooting.value} leaves or so. ` +
			'Mark the date on the pseudostem: the harvest is counted from it. Prop the plant if it leans.'
	};
}

export function budRemovalText(): StepText {
	return {
		title: 'Optional: cut off the male bud',
		detail:
			'Once the last hand of fruit has opened, the purple male bud at the end of the stalk may be cut off a hand-width below the last hand. ' +
			'It is optional when the plant is fed regularly.',
		cautions: cautions(CAUTION.blades, CAUTION.sap)
	};
}

/**
 * The longest flower-to-harvest interval reported for cool subtropical growing areas, days
 * (up to about 7 months in the open in the Canary Islands; docs/calibration.md lists the sources).
 */
export const LONGEST_PUBLISHED_FILL_DAYS = 210;

export function harvestText(cultivar: Cultivar, units: Units, fillDays: number): StepText {
	const beyondRecords =
		fillDays > LONGEST_PUBLISHED_FILL_DAYS
			? ` Here the bunch fills through a cool season: about ${fillDays} days after flowering is longer than any reported for banana-growing areas (up to about ${LONGEST_PUBLISHED_FILL_DAYS}), so treat the date as a rough guide and go by the fruit.`
			: '';
	return {
		title: 'Harvest the bunch',
		detail:
			'The bunch is ready when the fingers are plump, have filled out and lost their sharp angles, and the first ones are just starting to colour. ' +
			'From the start of this window the fingers may already be full enough to cut the bunch green and ripen it off the plant (see the ripening step); left on the plant, expect it ripe around the likely date. ' +
			`Cut the whole bunch (it can weigh ${massPhrase(cultivar.bunchMassKg.value, units)} or more).` +
			beyondRecords,
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

export function ripeningText(units: Units): StepText {
	return {
		title: 'Ripen the bunch off the plant',
		detail:
			'Hang the whole bunch upside down in cool shade with moving air, so the ethylene the fruit gives off blows away: ripened off the plant it is sweeter and does not split. ' +
			`Never keep green fruit below ${temperaturePhrase(13, units)}: it suffers chilling injury. ` +
			'If it ripens too fast: split the hands off the stalk and lay them by a fan; then move them indoors into air conditioning; then peel and freeze them.',
		cautions: cautions(CAUTION.falling, CAUTION.blades, CAUTION.sap)
	};
}

export function cutBackText(units: Units): StepText {
	return {
		title: 'Cut the pseudostem back',
		detail: `Right after the harvest, cut the old pseudostem down to ${lengthPhrase(1.2, 4, units)}: it holds water and feeds the followers.`,
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

export function stemRemovalText(): StepText {
	return {
		title: 'Remove the old stem',
		detail: 'About two weeks after the cut-back, cut the remaining stump at ground level and chop it up as mulch around the mat.',
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

export function feedingText(index: number, measure: string, npk: readonly [number, number, number]): StepText {
	const [n, p, k] = npk;
	return {
		title: `Feed the mat: ${measure}`,
		detail:
			`Scatter ${measure} of ${n}-${p}-${k} fertilizer (high potassium) in a ring around the mat, ` +
			'away from the stems, and water it in. The amount is for the whole mat, one to four plants, not for each plant. ' +
			(index === 0 ? 'Start now that the plant has put out two new leaves.' : 'Repeat every month.')
	};
}

export function restrictionCaution(month: number): string {
	return `Local rules restrict nitrogen and phosphorus fertilizer in ${MONTH_NAMES[month - 1]}: you may skip this feeding, or use only a product and amount the rule allows.`;
}

export function nitrogenCapCaution(rateKgPer100m2: number, areaM2: number, capKgPer100m2: number): string {
	return `This feeding puts about ${rateKgPer100m2.toFixed(2)} kg N per 100 m² on the mat's ${areaM2} m², above the local cap of ${capKgPer100m2} kg N per 100 m² per application: spread it wider or split it, as the rule says.`;
}
