/**
 * The life model: when each moment of a stem's life comes, as forecasts (forecast.ts) measured
 * from the facts the plan knows. Development is counted in degree-days at the full rate; a
 * follower grows held back while its mother stands and at the full rate once she is harvested
 * (or lost), so the next bunch on a mat comes months after the last, not weeks.
 */
import type { Cultivar, Observed } from './types';
import { parseIsoDate, type EpochDay } from './dates';
import type { ThermalClock } from './thermal';
import { after, factOn, from, likelyTt, noLaterThan, observedOn, type Forecast } from './forecast';
import {
	BUD_REMOVAL_AFTER_SHOOTING_DEGREE_DAYS,
	FOLLOWERS_AGE_DEGREE_DAYS,
	HELD_BACK_RATE,
	THINNING_AFTER_FOLLOWERS_DEGREE_DAYS,
	WAIST_HEIGHT_AFTER_FOLLOWERS_DEGREE_DAYS,
	degreeDaysForLeaves,
	leavesAtPlanting,
	shootingToGreenCutDegreeDays,
	shootingToHarvestDegreeDays
} from './model';

export interface LifeContext {
	cultivar: Cultivar;
	/** The development clock (`leafEmissionRate`): every distance in a forecast is measured on it. */
	clock: ThermalClock;
	plantDay: EpochDay;
}

/** Where a stem's development stands: `progress` degree-days (at the full rate) reached by `start`. */
interface Development {
	start: Forecast;
	progress: number;
	/** The mother's end (harvest or loss): until then this stem grows at HELD_BACK_RATE. */
	release?: Forecast;
}

export interface Life {
	generation: number;
	/** The day the stem starts: planting for the plant sold, emergence for a follower. */
	birth: Forecast;
	followers: Forecast;
	thinning: Forecast;
	division: Forecast;
	flagLeaf: Forecast;
	shooting: Forecast;
	budRemoval: Forecast;
	/** The commercial grade: from here the bunch may be cut green and ripened off the plant. */
	greenCut: Forecast;
	/** The home harvest: fingers plump and just colouring on the plant. */
	harvest: Forecast;
	cutBackOn?: EpochDay;
	stemRemovedOn?: EpochDay;
	lostOn?: EpochDay;
	/** When this stem stops holding back its follower: its harvest, or the day it was lost if earlier. */
	release: Forecast;
}

/** The moment a stem's development reaches `target` degree-days. */
export function reaching(dev: Development, target: number): Forecast {
	const remaining = Math.max(0, target - dev.progress);
	if (!dev.release) return after(dev.start, remaining);
	const heldBackSpan = likelyTt(dev.release) - likelyTt(dev.start);
	if (heldBackSpan <= 0) return after(dev.start, remaining);
	const heldBackProgress = heldBackSpan * HELD_BACK_RATE;
	if (remaining <= heldBackProgress) return after(dev.start, remaining / HELD_BACK_RATE);
	return after(dev.release, remaining - heldBackProgress);
}

/** The age is lived in the same garden climate over the weeks before planting. */
export function thermalAgeAtPlanting(ctx: LifeContext, ageWeeks: number): number {
	return ctx.clock.cumulativeAt(ctx.plantDay) - ctx.clock.cumulativeAt(ctx.plantDay - Math.round(ageWeeks * 7));
}

function logged(ctx: LifeContext, iso: string | undefined): Forecast | undefined {
	return iso === undefined ? undefined : observedOn(ctx.clock, parseIsoDate(iso));
}

/** One stem's life from where its development stands and what was logged about it. */
function stemLife(ctx: LifeContext, generation: number, birth: Forecast, born: Development, observed: Observed): Life {
	const { cultivar, clock } = ctx;
	const toShooting = degreeDaysForLeaves(cultivar, cultivar.leavesToShooting.value);
	const oneLeaf = degreeDaysForLeaves(cultivar, 1);
	// A logged leaf count replaces the estimate of where the stem stands.
	const count = observed.leafCount;
	const grown: Development = count
		? { ...born, start: from(factOn(clock, parseIsoDate(count.on)), 0), progress: degreeDaysForLeaves(cultivar, count.leaves) }
		: born;

	const flagLogged = logged(ctx, observed.flagLeafOn);
	const shotLogged = logged(ctx, observed.shotOn);
	const harvestLogged = logged(ctx, observed.harvestedOn);
	const cutBackLogged = logged(ctx, observed.cutBackOn);
	const stemRemovedLogged = logged(ctx, observed.stemRemovedOn);

	// The flower follows the flag leaf by one leaf interval; a logged flag leaf restarts the count from it.
	const beforeFlower: Development = flagLogged ? { ...grown, start: flagLogged, progress: toShooting - oneLeaf } : grown;
	let shooting = shotLogged ?? reaching(beforeFlower, toShooting);
	let harvest = harvestLogged ?? after(shooting, shootingToHarvestDegreeDays(cultivar));
	// A bunch is cut by the day its stem was cut back or removed.
	for (const limit of [cutBackLogged, stemRemovedLogged]) if (limit) harvest = noLaterThan(harvest, limit);
	const greenCut = harvestLogged ?? noLaterThan(after(shooting, shootingToGreenCutDegreeDays(cultivar)), harvest);
	shooting = noLaterThan(shooting, harvest);
	// A logged flower puts the flag leaf one leaf interval before it.
	const flagLeaf = flagLogged ?? noLaterThan(shotLogged ? after(shotLogged, -oneLeaf) : reaching(grown, toShooting - oneLeaf), shooting);
	const followers = noLaterThan(logged(ctx, observed.followersOn) ?? reaching(grown, FOLLOWERS_AGE_DEGREE_DAYS), shooting);

	const lostDay = observed.lostOn === undefined ? undefined : parseIsoDate(observed.lostOn);
	const lostFirst = lostDay !== undefined && clock.cumulativeAt(lostDay) < likelyTt(harvest);
	return {
		generation,
		birth,
		followers,
		thinning: after(followers, THINNING_AFTER_FOLLOWERS_DEGREE_DAYS),
		division: after(followers, WAIST_HEIGHT_AFTER_FOLLOWERS_DEGREE_DAYS),
		flagLeaf,
		shooting,
		budRemoval: noLaterThan(after(shooting, BUD_REMOVAL_AFTER_SHOOTING_DEGREE_DAYS), harvest),
		greenCut,
		harvest,
		...(cutBackLogged ? { cutBackOn: cutBackLogged.observedDay } : {}),
		...(stemRemovedLogged ? { stemRemovedOn: stemRemovedLogged.observedDay } : {}),
		...(lostDay !== undefined ? { lostOn: lostDay } : {}),
		release: lostFirst ? observedOn(clock, lostDay) : harvest
	};
}

/** The plant sold: it starts at planting with the development its age gave it. */
export function motherLife(ctx: LifeContext, ageWeeks: number, observed: Observed): Life {
	const planting = from(factOn(ctx.clock, ctx.plantDay), 0);
	const progress = degreeDaysForLeaves(ctx.cultivar, leavesAtPlanting(ctx.cultivar, thermalAgeAtPlanting(ctx, ageWeeks)));
	return stemLife(ctx, 0, planting, { start: planting, progress }, observed);
}

/** A follower starts the day its parent's followers showed, held back until its parent is gone. */
export function followerLife(ctx: LifeContext, parent: Life, observed: Observed): Life {
	const birth = parent.followers;
	return stemLife(ctx, parent.generation + 1, birth, { start: birth, progress: 0, release: parent.release }, observed);
}

/** Thermal time before planting, for the feeding start: leaves already out at planting. */
export function leavesOutAtPlanting(ctx: LifeContext, ageWeeks: number): number {
	return leavesAtPlanting(ctx.cultivar, thermalAgeAtPlanting(ctx, ageWeeks));
}
