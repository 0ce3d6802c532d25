/**
 * computePlan: the care plan of one mat, from the plant sold (generation 0) through its followers.
 *
 * Every forecast is a point in thermal time plus the last known fact it is measured from (its
 * anchor). The window around it is a share of the thermal distance from that anchor, so logged
 * milestones narrow everything downstream and later generations widen.
 */
import type { Cultivar, FeedingSettings, Observed, Plan, PlanInput, Step, StepKind, Units } from './types';
import { formatIsoDate, parseIsoDate, type EpochDay } from './dates';
import { thermalClockFor, type ThermalClock } from './thermal';
import {
	BUD_REMOVAL_AFTER_SHOOTING_DEGREE_DAYS,
	FOLLOWERS_AGE_DEGREE_DAYS,
	MIN_ANNUAL_DEGREE_DAYS,
	NEW_LEAVES_BEFORE_FEEDING,
	STEM_REMOVAL_AFTER_CUT_BACK_DAYS,
	THINNING_AFTER_FOLLOWERS_DEGREE_DAYS,
	WAIST_HEIGHT_AFTER_FOLLOWERS_DEGREE_DAYS,
	degreeDaysForLeaves,
	leavesAtPlanting,
	shootingToHarvestDegreeDays,
	windowShare
} from './model';
import { defaultFeeding, feedingSteps, validateFeeding } from './feeding';
import { CAUTION, cautions } from './cautions';
import { lengthPhrase, massPhrase, temperaturePhrase } from './units';

export const DEFAULT_GENERATIONS = 3;
const MAX_GENERATIONS = 10;

/** Fixed order of kinds on the same day, in the order the work happens. */
export const KIND_ORDER: readonly StepKind[] = [
	'planting',
	'feeding',
	'followers',
	'thinning',
	'division',
	'flag-leaf',
	'shooting',
	'bud-removal',
	'harvest',
	'ripening',
	'cut-back',
	'stem-removal'
];

/** Guide slug for each kind of step. */
export const GUIDE_FOR: Readonly<Record<StepKind, string>> = {
	planting: 'planting',
	feeding: 'feeding',
	followers: 'followers-and-thinning',
	thinning: 'followers-and-thinning',
	division: 'division',
	'flag-leaf': 'flowering',
	shooting: 'flowering',
	'bud-removal': 'flowering',
	harvest: 'harvest',
	ripening: 'ripening',
	'cut-back': 'after-harvest',
	'stem-removal': 'after-harvest'
};

interface Fact {
	tt: number;
	day: EpochDay;
}

/** One way of reaching a moment: a thermal time measured from a known fact. */
interface Route {
	tt: number;
	anchor: Fact;
}

/**
 * A forecast moment: the earliest of its routes. A moment that cannot pass a later milestone
 * (followers before the bunch, the bunch before a logged harvest) gains that milestone's routes,
 * so every window stays a minimum of windows that each grow with the distance from a fixed day.
 */
interface Forecast {
	routes: Route[];
	/** Set when the gardener logged this milestone. */
	observedDay?: EpochDay;
}

interface Window {
	earliest: EpochDay;
	likely: EpochDay;
	latest: EpochDay;
	observed: boolean;
}

interface Life {
	generation: number;
	followers: Forecast;
	thinning: Forecast;
	division: Forecast;
	flagLeaf: Forecast;
	shooting: Forecast;
	budRemoval: Forecast;
	harvest: Forecast;
}

interface Context {
	cultivar: Cultivar;
	clock: ThermalClock;
	plantDay: EpochDay;
	units: Units;
}

function factOn(clock: ThermalClock, day: EpochDay): Fact {
	return { tt: clock.cumulativeAt(day), day };
}

function observedOn(clock: ThermalClock, day: EpochDay): Forecast {
	const fact = factOn(clock, day);
	return { routes: [{ tt: fact.tt, anchor: fact }], observedDay: day };
}

function from(anchor: Fact, degreeDays: number): Forecast {
	return { routes: [{ tt: anchor.tt + degreeDays, anchor }] };
}

function after(base: Forecast, degreeDays: number): Forecast {
	return { routes: base.routes.map((r) => ({ tt: r.tt + degreeDays, anchor: r.anchor })) };
}

/** Routes from the same fact differ only in distance: the nearest one is always the earliest. */
function merged(routes: Route[]): Route[] {
	const byAnchor = new Map<EpochDay, Route>();
	for (const r of routes) {
		const kept = byAnchor.get(r.anchor.day);
		if (!kept || r.tt < kept.tt) byAnchor.set(r.anchor.day, r);
	}
	return [...byAnchor.values()];
}

function noLaterThan(f: Forecast, limit: Forecast): Forecast {
	return f.observedDay !== undefined ? f : { routes: merged([...f.routes, ...limit.routes]) };
}

function routeWindow(ctx: Context, r: Route, share: number): Window {
	const spread = (r.tt - r.anchor.tt) * share;
	const at = (tt: number) => ctx.clock.dayReaching(tt, r.anchor.day);
	return { earliest: at(r.tt - spread), likely: at(r.tt), latest: at(r.tt + spread), observed: false };
}

function windowOf(ctx: Context, f: Forecast, generation: number): Window {
	if (f.observedDay !== undefined) return { earliest: f.observedDay, likely: f.observedDay, latest: f.observedDay, observed: true };
	const share = windowShare(generation);
	return f.routes
		.map((r) => routeWindow(ctx, r, share))
		.reduce((a, b) => ({
			earliest: Math.min(a.earliest, b.earliest),
			likely: Math.min(a.likely, b.likely),
			latest: Math.min(a.latest, b.latest),
			observed: false
		}));
}

function shiftWindow(w: Window, days: number): Window {
	return { earliest: w.earliest + days, likely: w.likely + days, latest: w.latest + days, observed: false };
}

/** The rest of a plant's life once its followers, flag leaf, shooting and harvest are set. */
function lifeFrom(generation: number, followers: Forecast, flagLeaf: Forecast, shooting: Forecast, harvest: Forecast): Life {
	const shot = noLaterThan(shooting, harvest);
	const followersOut = noLaterThan(followers, shot);
	return {
		generation,
		followers: followersOut,
		thinning: after(followersOut, THINNING_AFTER_FOLLOWERS_DEGREE_DAYS),
		division: after(followersOut, WAIST_HEIGHT_AFTER_FOLLOWERS_DEGREE_DAYS),
		flagLeaf: noLaterThan(flagLeaf, shot),
		shooting: shot,
		budRemoval: noLaterThan(after(shot, BUD_REMOVAL_AFTER_SHOOTING_DEGREE_DAYS), harvest),
		harvest
	};
}

/** The age is lived in the same garden climate over the weeks before planting. */
function thermalAgeAtPlanting(ctx: Context, ageWeeks: number): number {
	return ctx.clock.cumulativeAt(ctx.plantDay) - ctx.clock.cumulativeAt(ctx.plantDay - Math.round(ageWeeks * 7));
}

/** The plant sold: its development starts from its estimated age and any logged milestones. */
function motherLife(ctx: Context, ageWeeks: number, observed: Observed): Life {
	const { clock, cultivar, plantDay } = ctx;
	const leaves = cultivar.leavesToShooting.value;
	const planting = factOn(clock, plantDay);
	const thermalAge = thermalAgeAtPlanting(ctx, ageWeeks);
	const count = observed.leafCount;
	// A logged count replaces the estimate of the leaves already out.
	const leafFact = count ? factOn(clock, parseIsoDate(count.on)) : planting;
	const leavesKnown = count ? count.leaves : leavesAtPlanting(cultivar, thermalAge);
	const leafForecast = (leafNumber: number) => from(leafFact, degreeDaysForLeaves(cultivar, leafNumber - leavesKnown));

	const shooting = observed.shotOn ? observedOn(clock, parseIsoDate(observed.shotOn)) : leafForecast(leaves);
	// The flag leaf is the last leaf, one leaf interval before the bunch.
	const flagLeaf = leafForecast(leaves - 1);
	const harvest = observed.harvestedOn ? observedOn(clock, parseIsoDate(observed.harvestedOn)) : after(shooting, shootingToHarvestDegreeDays(cultivar));
	const followers = observed.followersOn
		? observedOn(clock, parseIsoDate(observed.followersOn))
		: from(planting, Math.max(0, FOLLOWERS_AGE_DEGREE_DAYS - thermalAge));
	return lifeFrom(0, followers, flagLeaf, shooting, harvest);
}

/** A follower's life runs from its own emergence, the day its parent's followers showed. */
function followerLife(ctx: Context, parent: Life): Life {
	const { cultivar } = ctx;
	const birth = parent.followers;
	const shooting = after(birth, degreeDaysForLeaves(cultivar, cultivar.leavesToShooting.value));
	return lifeFrom(
		parent.generation + 1,
		after(birth, FOLLOWERS_AGE_DEGREE_DAYS),
		after(birth, degreeDaysForLeaves(cultivar, cultivar.leavesToShooting.value - 1)),
		shooting,
		after(shooting, shootingToHarvestDegreeDays(cultivar))
	);
}

interface StepText {
	title: string;
	detail: string;
	cautions?: string[];
}

function step(kind: StepKind, generation: number, w: Window, text: StepText): Step {
	const s: Step = {
		kind,
		title: text.title,
		detail: text.detail,
		earliest: formatIsoDate(w.earliest),
		likely: formatIsoDate(w.likely),
		latest: formatIsoDate(w.latest),
		generation,
		guide: GUIDE_FOR[kind]
	};
	if (w.observed) s.observed = true;
	if (text.cautions) s.cautions = text.cautions;
	return s;
}

function plantName(generation: number): string {
	return generation === 0 ? 'the plant you bought' : `follower ${generation}`;
}

function plantingText(ctx: Context): StepText {
	return {
		title: `Plant your ${ctx.cultivar.name}`,
		detail:
			'Dig the hole, set the plant at the same depth it grew in the pot, and backfill with the soil that came out of the hole. ' +
			'Choose full sun. Water so the soil stays moist to the touch, never waterlogged.',
		cautions: cautions(CAUTION.quarantine, CAUTION.lifting)
	};
}

function followersText(generation: number): StepText {
	return {
		title: `Followers appear at the base of ${plantName(generation)}`,
		detail:
			'One or two suckers show at about six months of age. Keep sword suckers (narrow, sword-shaped leaves on a broad base): ' +
			'they grow into strong bearing plants. Broad-leaved water suckers are weakly attached and bear poorly: remove them.',
		cautions: cautions(CAUTION.blades, CAUTION.sap)
	};
}

function thinningText(generation: number): StepText {
	return {
		title: 'Thin the mat',
		detail:
			`Around ${plantName(generation)}, keep at most four plants at staggered sizes, from a new shoot to the bearing plant, so one bunch follows another. ` +
			'Cut surplus suckers at ground level and dig out their growing point. Commercial growers keep only two per mat for bigger bunches.',
		cautions: cautions(CAUTION.blades, CAUTION.sap)
	};
}

function divisionText(units: Units): StepText {
	return {
		title: 'Divide off a fifth plant',
		detail:
			`If the mat has a fifth plant that has reached about waist height (${lengthPhrase(1, 3, units)}), dig the planting hole first, ` +
			'then cut the sucker from the mother with a sharp spade, lift it with its roots and replant it straight away. ' +
			'The division becomes a new plant with its own care plan.',
		cautions: cautions(CAUTION.blades, CAUTION.lifting, CAUTION.quarantine)
	};
}

function flagLeafText(generation: number): StepText {
	return {
		title: `Flag leaf on ${plantName(generation)}`,
		detail: 'A short, stiff, upright leaf comes out last, just before the flower: the bunch is on its way.'
	};
}

function shootingText(generation: number, ctx: Context): StepText {
	return {
		title: `${generation === 0 ? 'Your plant' : `Follower ${generation}`} flowers (shooting)`,
		detail:
			`The flower stalk pushes out of the top, usually after ${ctx.cultivar.leavesToShooting.value} leaves or so. ` +
			'Mark the date on the pseudostem: the harvest is counted from it. Prop the plant if it leans.'
	};
}

function budRemovalText(): StepText {
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
 * (85–110 in the tropics, up to about 210 in cool subtropics; the figures this model was calibrated against).
 */
export const LONGEST_PUBLISHED_FILL_DAYS = 210;

function harvestText(ctx: Context, fillDays: number): StepText {
	const beyondRecords =
		fillDays > LONGEST_PUBLISHED_FILL_DAYS
			? ` Here the bunch fills through a cool season: about ${fillDays} days after flowering is longer than any reported for banana-growing areas (up to about ${LONGEST_PUBLISHED_FILL_DAYS}), so treat the date as a rough guide and go by the fruit.`
			: '';
	return {
		title: 'Harvest the bunch',
		detail:
			'The bunch is ready when the fingers are plump, have filled out and lost their sharp angles, and the first ones are just starting to colour. ' +
			`Cut the whole bunch (it can weigh ${massPhrase(ctx.cultivar.bunchMassKg.value, ctx.units)} or more).` +
			beyondRecords,
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

function ripeningText(units: Units): StepText {
	return {
		title: 'Ripen the bunch off the plant',
		detail:
			'Hang the whole bunch upside down in cool shade with moving air, so the ethylene the fruit gives off blows away: ripened off the plant it is sweeter and does not split. ' +
			`Never keep green fruit below ${temperaturePhrase(13, units)}: it suffers chilling injury. ` +
			'If it ripens too fast: split the hands off the stalk and lay them by a fan; then move them indoors into air conditioning; then peel and freeze them.',
		cautions: cautions(CAUTION.falling, CAUTION.blades, CAUTION.sap)
	};
}

function cutBackText(units: Units): StepText {
	return {
		title: 'Cut the pseudostem back',
		detail: `Right after the harvest, cut the old pseudostem down to ${lengthPhrase(1.2, 4, units)}: it holds water and feeds the followers.`,
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

function stemRemovalText(): StepText {
	return {
		title: 'Remove the old stem',
		detail: 'About two weeks after the cut-back, cut the remaining stump at ground level and chop it up as mulch around the mat.',
		cautions: cautions(CAUTION.blades, CAUTION.falling, CAUTION.sap)
	};
}

/** The steps of one plant's life, from its followers to the removal of its stem. */
function lifeSteps(ctx: Context, life: Life): { steps: Step[]; end: EpochDay } {
	const g = life.generation;
	const harvest = windowOf(ctx, life.harvest, g);
	const shooting = windowOf(ctx, life.shooting, g);
	const cutBack: Window = { ...harvest, observed: false };
	const stemRemoval = shiftWindow(cutBack, STEM_REMOVAL_AFTER_CUT_BACK_DAYS);
	const steps = [
		step('followers', g, windowOf(ctx, life.followers, g), followersText(g)),
		step('thinning', g, windowOf(ctx, life.thinning, g), thinningText(g)),
		step('division', g, windowOf(ctx, life.division, g), divisionText(ctx.units)),
		step('flag-leaf', g, windowOf(ctx, life.flagLeaf, g), flagLeafText(g)),
		step('shooting', g, shooting, shootingText(g, ctx)),
		step('bud-removal', g, windowOf(ctx, life.budRemoval, g), budRemovalText()),
		step('harvest', g, harvest, harvestText(ctx, harvest.likely - shooting.likely)),
		step('ripening', g, { ...harvest, observed: false }, ripeningText(ctx.units)),
		step('cut-back', g, cutBack, cutBackText(ctx.units)),
		step('stem-removal', g, stemRemoval, stemRemovalText())
	];
	return { steps, end: stemRemoval.likely };
}

/** Feeding starts at the second new leaf; a logged count showing it already happened brings it forward. */
function firstFeedingWindow(ctx: Context, observed: Observed, leavesOutAtPlanting: number): Window {
	const planting = factOn(ctx.clock, ctx.plantDay);
	const forecast = windowOf(ctx, from(planting, degreeDaysForLeaves(ctx.cultivar, NEW_LEAVES_BEFORE_FEEDING)), 0);
	const count = observed.leafCount;
	if (!count || count.leaves < leavesOutAtPlanting + NEW_LEAVES_BEFORE_FEEDING) return forecast;
	const countDay = parseIsoDate(count.on);
	return {
		earliest: Math.min(forecast.earliest, countDay),
		likely: Math.min(forecast.likely, countDay),
		latest: Math.min(forecast.latest, countDay),
		observed: false
	};
}

function validateInput(input: PlanInput, plantDay: EpochDay): number {
	const generations = input.generations ?? DEFAULT_GENERATIONS;
	if (!Number.isInteger(generations) || generations < DEFAULT_GENERATIONS || generations > MAX_GENERATIONS) {
		throw new RangeError(`generations must be an integer from ${DEFAULT_GENERATIONS} to ${MAX_GENERATIONS}`);
	}
	if (!Number.isFinite(input.ageAtPlantingWeeks) || input.ageAtPlantingWeeks < 0 || input.ageAtPlantingWeeks > 520) {
		throw new RangeError('ageAtPlantingWeeks must be between 0 and 520');
	}
	if (input.cultivar.leavesToShooting.value < NEW_LEAVES_BEFORE_FEEDING + 1) throw new RangeError('leavesToShooting is too small');
	const o = input.observed ?? {};
	const logged = [o.leafCount?.on, o.followersOn, o.shotOn, o.harvestedOn].filter((d): d is string => d !== undefined);
	if (logged.some((d) => parseIsoDate(d) < plantDay)) throw new RangeError('A logged milestone is dated before planting.');
	if (o.shotOn && o.harvestedOn && parseIsoDate(o.harvestedOn) < parseIsoDate(o.shotOn)) {
		throw new RangeError('The logged harvest is dated before the logged shooting.');
	}
	if (o.leafCount && !(Number.isFinite(o.leafCount.leaves) && o.leafCount.leaves >= 0)) throw new RangeError('A leaf count must be ≥ 0.');
	return generations;
}

function compareSteps(a: { step: Step; likely: number }, b: { step: Step; likely: number }): number {
	return a.likely - b.likely || a.step.generation - b.step.generation || KIND_ORDER.indexOf(a.step.kind) - KIND_ORDER.indexOf(b.step.kind);
}

export function computePlan(input: PlanInput): Plan {
	const plantDay = parseIsoDate(input.plantedOn);
	const generations = validateInput(input, plantDay);
	const clock = thermalClockFor(input.climate.monthlyMeanC);
	if (clock.commonYear < MIN_ANNUAL_DEGREE_DAYS) {
		throw new RangeError(`This climate gives ${Math.round(clock.commonYear)} °C·d a year; bananas need at least ${MIN_ANNUAL_DEGREE_DAYS} to fruit.`);
	}
	const feeding: FeedingSettings = input.feeding ?? defaultFeeding;
	validateFeeding(feeding);
	const observed = input.observed ?? {};
	const ctx: Context = { cultivar: input.cultivar, clock, plantDay, units: input.units ?? 'metric' };

	const steps: Step[] = [step('planting', 0, { earliest: plantDay, likely: plantDay, latest: plantDay, observed: false }, plantingText(ctx))];
	let life = motherLife(ctx, input.ageAtPlantingWeeks, observed);
	let horizonEnd = plantDay;
	for (let g = 0; g < generations; g++) {
		if (g > 0) life = followerLife(ctx, life);
		const part = lifeSteps(ctx, life);
		steps.push(...part.steps);
		horizonEnd = Math.max(horizonEnd, part.end);
	}

	const leavesOut = leavesAtPlanting(ctx.cultivar, thermalAgeAtPlanting(ctx, input.ageAtPlantingWeeks));
	const firstFeeding = firstFeedingWindow(ctx, observed, leavesOut);
	steps.push(...feedingSteps(firstFeeding, horizonEnd, feeding, ctx.units, GUIDE_FOR.feeding));

	const keyed = steps.map((s) => ({ step: s, likely: parseIsoDate(s.likely) }));
	keyed.sort(compareSteps);
	return { steps: keyed.map((k) => k.step) };
}
