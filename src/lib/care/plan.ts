/**
 * computePlan: the care plan of one mat, from the plant sold (generation 0) through its followers.
 * The assembly only: the forecast algebra is in forecast.ts, the life model in life.ts, the
 * wording in wording.ts, the feeding ramp in feeding.ts and the refusals in validate.ts.
 */
import type { FeedingSettings, Observed, Plan, PlanInput, Step, StepKind, Units } from './types';
import { formatIsoDate, parseIsoDate, type EpochDay } from './dates';
import { leafClockFor, thermalClockFor, type ThermalClock } from './thermal';
import { factOn, from, pinnedWindow, shiftWindow, windowOf, type Forecast, type Window } from './forecast';
import { followerLife, leavesOutAtPlanting, motherLife, type Life, type LifeContext } from './life';
import { NEW_LEAVES_BEFORE_FEEDING, STEM_REMOVAL_AFTER_CUT_BACK_DAYS, climateCoolness, degreeDaysForLeaves, windowShare } from './model';
import { defaultFeeding, feedingSteps, validateFeeding } from './feeding';
import { PlanInputError, generationsOf, planInputIssues } from './validate';
import { PLAN_BOUNDS, STEP_KINDS } from './vocabulary';
import * as wording from './wording';

export const DEFAULT_GENERATIONS = PLAN_BOUNDS.generations.default;

/** Fixed order of kinds on the same day, in the order the work happens. */
export const KIND_ORDER: readonly StepKind[] = STEP_KINDS;

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

interface Context extends LifeContext {
	clock: ThermalClock;
	units: Units;
	/** How far the garden's year falls short of the reference climate's: widens every window. */
	coolness: number;
}

function step(kind: StepKind, generation: number, w: Window, text: wording.StepText): Step {
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

/**
 * The harvest window opens when the bunch could first be cut green and ripened off the plant,
 * and its likely day is the home harvest on the plant; a logged harvest stays where it was logged.
 */
function opensAtGreenCut(ripe: Window, green: Window): Window {
	return ripe.observed ? ripe : { ...ripe, earliest: Math.min(ripe.earliest, green.earliest) };
}

/** The steps of one stem's life, from its followers to the removal of its stem. */
function lifeSteps(ctx: Context, life: Life): { steps: Step[]; end: EpochDay } {
	const g = life.generation;
	const share = windowShare(g, ctx.coolness);
	const win = (f: Forecast) => windowOf(ctx.clock, f, share, ctx.plantDay);
	const harvest = opensAtGreenCut(win(life.harvest), win(life.greenCut));
	const shooting = win(life.shooting);
	const cutBack: Window = life.cutBackOn !== undefined ? pinnedWindow(life.cutBackOn, true) : { ...harvest, observed: false };
	const stemRemoval = life.stemRemovedOn !== undefined ? pinnedWindow(life.stemRemovedOn, true) : shiftWindow(cutBack, STEM_REMOVAL_AFTER_CUT_BACK_DAYS);
	const steps = [
		step('followers', g, win(life.followers), wording.followersText(g)),
		step('thinning', g, win(life.thinning), wording.thinningText(g)),
		step('division', g, win(life.division), wording.divisionText(ctx.units)),
		step('flag-leaf', g, win(life.flagLeaf), wording.flagLeafText(g)),
		step('shooting', g, shooting, wording.shootingText(g, ctx.cultivar)),
		step('bud-removal', g, win(life.budRemoval), wording.budRemovalText()),
		step('harvest', g, harvest, wording.harvestText(ctx.cultivar, ctx.units, harvest.likely - shooting.likely)),
		step('ripening', g, { ...harvest, observed: false }, wording.ripeningText(ctx.units)),
		step('cut-back', g, cutBack, wording.cutBackText(ctx.units)),
		step('stem-removal', g, stemRemoval, wording.stemRemovalText())
	];
	if (life.lostOn === undefined) return { steps, end: stemRemoval.likely };
	// A lost stem keeps what was done or logged before the loss; the rest will not happen.
	const lost = life.lostOn;
	const kept = steps.filter((s) => s.observed || parseIsoDate(s.likely) <= lost);
	return { steps: kept, end: lost };
}

/** Feeding starts at the second new leaf; a logged count showing it already happened brings it forward. */
function firstFeedingWindow(ctx: Context, observed: Observed, leavesOutAtPlanting: number): Window {
	const planting = factOn(ctx.clock, ctx.plantDay);
	const forecast = windowOf(ctx.clock, from(planting, degreeDaysForLeaves(ctx.cultivar, NEW_LEAVES_BEFORE_FEEDING)), windowShare(0, ctx.coolness), ctx.plantDay);
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

function compareSteps(a: { step: Step; likely: number }, b: { step: Step; likely: number }): number {
	return a.likely - b.likely || a.step.generation - b.step.generation || KIND_ORDER.indexOf(a.step.kind) - KIND_ORDER.indexOf(b.step.kind);
}

/** A stem lost before its followers showed leaves no follower: the mat ends with it. */
function leavesAFollower(ctx: Context, life: Life): boolean {
	if (life.lostOn === undefined) return true;
	const followers = windowOf(ctx.clock, life.followers, windowShare(life.generation, ctx.coolness), ctx.plantDay);
	return followers.likely <= life.lostOn;
}

export function computePlan(input: PlanInput): Plan {
	const issues = planInputIssues(input, () => thermalClockFor(input.climate.monthlyMeanC).commonYear);
	if (issues.length > 0) throw new PlanInputError(issues);
	const plantDay = parseIsoDate(input.plantedOn);
	const generations = generationsOf(input);
	const clock = leafClockFor(input.climate.monthlyMeanC);
	const feeding: FeedingSettings = input.feeding ?? defaultFeeding;
	validateFeeding(feeding);
	const observed = input.observed ?? {};
	const ctx: Context = { cultivar: input.cultivar, clock, plantDay, units: input.units ?? 'metric', coolness: climateCoolness(clock.commonYear) };

	const steps: Step[] = [step('planting', 0, pinnedWindow(plantDay), wording.plantingText(ctx.cultivar))];
	const lost: { generation: number; on: string }[] = [];
	let life = motherLife(ctx, input.ageAtPlantingWeeks, observed);
	let horizonEnd = plantDay;
	for (let g = 0; g < generations; g++) {
		if (g > 0) {
			if (!leavesAFollower(ctx, life)) break;
			life = followerLife(ctx, life, input.observedFollowers?.[g - 1] ?? {});
		}
		const part = lifeSteps(ctx, life);
		steps.push(...part.steps);
		if (life.lostOn !== undefined) lost.push({ generation: g, on: formatIsoDate(life.lostOn) });
		horizonEnd = Math.max(horizonEnd, part.end);
	}

	const firstFeeding = firstFeedingWindow(ctx, observed, leavesOutAtPlanting(ctx, input.ageAtPlantingWeeks));
	steps.push(...feedingSteps(firstFeeding, horizonEnd, feeding, ctx.units, GUIDE_FOR.feeding));

	const keyed = steps.map((s) => ({ step: s, likely: parseIsoDate(s.likely) }));
	keyed.sort(compareSteps);
	const plan: Plan = { steps: keyed.map((k) => k.step) };
	if (lost.length > 0) plan.lost = lost;
	return plan;
}
