/**
 * The forecast algebra: moments in thermal time measured from known facts, and their windows.
 *
 * A fact is a day the plan knows (planting, or a logged milestone) with the thermal time reached
 * by it. A forecast is the earliest of one or more routes, each a thermal time measured from a
 * fact; its window is ± a share of the thermal distance from that fact, so windows grow with the
 * distance from what is known and shrink when a milestone is logged. Nothing here knows about
 * bananas: the life model (life.ts) says which distances to use.
 */
import type { EpochDay } from './dates';

/** The two questions the algebra asks of a climate (ThermalClock answers them). */
export interface Clock {
	cumulativeAt(day: EpochDay): number;
	dayReaching(target: number, notBefore: EpochDay): EpochDay;
}

export interface Fact {
	tt: number;
	day: EpochDay;
}

/** One way of reaching a moment: a thermal time measured from a known fact. */
export interface Route {
	tt: number;
	anchor: Fact;
}

/**
 * A forecast moment: the earliest of its routes. A moment that cannot pass a later milestone
 * (followers before the bunch, the bunch before a logged harvest) gains that milestone's routes,
 * so every window stays a minimum of windows that each grow with the distance from a fixed day.
 */
export interface Forecast {
	routes: Route[];
	/** Set when the gardener logged this milestone. */
	observedDay?: EpochDay;
}

export interface Window {
	earliest: EpochDay;
	likely: EpochDay;
	latest: EpochDay;
	observed: boolean;
}

export function factOn(clock: Clock, day: EpochDay): Fact {
	return { tt: clock.cumulativeAt(day), day };
}

export function observedOn(clock: Clock, day: EpochDay): Forecast {
	const fact = factOn(clock, day);
	return { routes: [{ tt: fact.tt, anchor: fact }], observedDay: day };
}

export function from(anchor: Fact, degreeDays: number): Forecast {
	return { routes: [{ tt: anchor.tt + degreeDays, anchor }] };
}

/** A moment `degreeDays` after another; negative distances reach back before it. */
export function after(base: Forecast, degreeDays: number): Forecast {
	return { routes: base.routes.map((r) => ({ tt: r.tt + degreeDays, anchor: r.anchor })) };
}

/** The thermal time of the forecast's likely moment. */
export function likelyTt(f: Forecast): number {
	return Math.min(...f.routes.map((r) => r.tt));
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

/** `f`, but never after `limit`; a logged moment stays where it was logged. */
export function noLaterThan(f: Forecast, limit: Forecast): Forecast {
	return f.observedDay !== undefined ? f : { routes: merged([...f.routes, ...limit.routes]) };
}

/**
 * A route's window. `floor` is the first day any moment can fall on (planting): a route reaching
 * back from its fact is clamped there, a route forward is clamped to its own fact.
 */
function routeWindow(clock: Clock, r: Route, share: number, floor: EpochDay): Window {
	const distance = r.tt - r.anchor.tt;
	const spread = Math.abs(distance) * share;
	const notBefore = distance >= 0 ? r.anchor.day : floor;
	const at = (tt: number) => clock.dayReaching(tt, notBefore);
	return { earliest: at(r.tt - spread), likely: at(r.tt), latest: at(r.tt + spread), observed: false };
}

/** The window of a forecast: the earliest of its routes' windows, or the logged day itself. */
export function windowOf(clock: Clock, f: Forecast, share: number, floor: EpochDay): Window {
	if (f.observedDay !== undefined) return { earliest: f.observedDay, likely: f.observedDay, latest: f.observedDay, observed: true };
	return f.routes
		.map((r) => routeWindow(clock, r, share, floor))
		.reduce((a, b) => ({
			earliest: Math.min(a.earliest, b.earliest),
			likely: Math.min(a.likely, b.likely),
			latest: Math.min(a.latest, b.latest),
			observed: false
		}));
}

export function shiftWindow(w: Window, days: number): Window {
	return { earliest: w.earliest + days, likely: w.likely + days, latest: w.latest + days, observed: false };
}

export function pinnedWindow(day: EpochDay, observed = false): Window {
	return { earliest: day, likely: day, latest: day, observed };
}
