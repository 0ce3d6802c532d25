/**
 * Matching a freshly computed plan against the stored one. A step's identity is its generation,
 * kind and occurrence (the n-th feeding of the mat): the identity keeps its uid across
 * regenerations, so calendars move an event instead of adding a copy. Pure: no database.
 */
import type { IsoDate, Step } from '$lib/care';
import { parseIsoDate } from '$lib/care';

export interface StepIdentity {
	generation: number;
	kind: string;
	occurrence: number;
}

/** A computed step with its place among the steps of the same generation and kind. */
export type NumberedStep = Step & { occurrence: number };

/** What a stored step keeps between regenerations, beside its content. */
export interface StoredStep extends StepIdentity {
	uid: string;
	sequence: number;
	title: string;
	detail: string;
	earliest: IsoDate;
	likely: IsoDate;
	latest: IsoDate;
	amount: Step['amount'] | null;
	nutrients: Step['nutrients'] | null;
	cautions: string[] | null;
	guide: string | null;
	observed: boolean;
	restricted: boolean;
}

export const identityKey = (s: StepIdentity): string => `${s.generation}|${s.kind}|${s.occurrence}`;

/** Numbers repeated kinds (feedings) in date order within their generation; others get 0. */
export function numberSteps(steps: readonly Step[]): NumberedStep[] {
	const seen = new Map<string, number>();
	return steps.map((s) => {
		const key = `${s.generation}|${s.kind}`;
		const occurrence = seen.get(key) ?? 0;
		seen.set(key, occurrence + 1);
		return { ...s, occurrence };
	});
}

/** Days from one calendar date to another (positive: later). */
export const daysBetween = (from: IsoDate, to: IsoDate): number => parseIsoDate(to) - parseIsoDate(from);

/** The stored form of a computed step's content, for comparing and writing. */
export function storedContent(s: NumberedStep) {
	return {
		generation: s.generation,
		kind: s.kind,
		occurrence: s.occurrence,
		title: s.title,
		detail: s.detail,
		earliest: s.earliest,
		likely: s.likely,
		latest: s.latest,
		amount: s.amount ?? null,
		nutrients: s.nutrients ?? null,
		cautions: s.cautions ?? null,
		guide: s.guide ?? null,
		observed: s.observed === true,
		restricted: s.restricted !== undefined
	};
}
export type StepContent = ReturnType<typeof storedContent>;

const CONTENT_FIELDS = ['title', 'detail', 'earliest', 'likely', 'latest', 'amount', 'nutrients', 'cautions', 'guide', 'observed', 'restricted'] as const;

/** JSON with object keys sorted: PostgreSQL's jsonb gives keys back in its own order. */
function canonical(value: unknown): string {
	return JSON.stringify(value, (_key, v: unknown) =>
		v && typeof v === 'object' && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0))) : v
	);
}

function sameContent(a: StepContent, b: StoredStep): boolean {
	return CONTENT_FIELDS.every((f) => canonical(a[f]) === canonical(b[f]));
}

export interface StepMove {
	uid: string;
	generation: number;
	kind: string;
	occurrence: number;
	fromLikely: IsoDate;
	toLikely: IsoDate;
	/** Positive: later than before. */
	days: number;
}

export interface PlanDiff {
	/** Steps whose content is unchanged: nothing to write. */
	unchanged: StoredStep[];
	/** Existing steps whose content changed (dates, amount or wording): rewritten under the same uid, sequence raised. */
	changed: { uid: string; sequence: number; content: StepContent }[];
	/** Steps the stored plan did not have: they get a new uid. */
	added: StepContent[];
	/** Stored steps the new plan no longer has. */
	removed: StoredStep[];
	/** Of the changed steps, those whose likely day moved. */
	moved: StepMove[];
}

/** Compares a computed plan with the stored steps of the same plant, step by step identity. */
export function diffPlan(stored: readonly StoredStep[], computed: readonly Step[]): PlanDiff {
	const byKey = new Map(stored.map((s) => [identityKey(s), s]));
	const diff: PlanDiff = { unchanged: [], changed: [], added: [], removed: [], moved: [] };
	for (const step of numberSteps(computed)) {
		const content = storedContent(step);
		const key = identityKey(content);
		const old = byKey.get(key);
		if (!old) {
			diff.added.push(content);
			continue;
		}
		byKey.delete(key);
		if (sameContent(content, old)) {
			diff.unchanged.push(old);
			continue;
		}
		diff.changed.push({ uid: old.uid, sequence: old.sequence + 1, content });
		if (old.likely !== content.likely) {
			diff.moved.push({
				uid: old.uid,
				generation: content.generation,
				kind: content.kind,
				occurrence: content.occurrence,
				fromLikely: old.likely,
				toLikely: content.likely,
				days: daysBetween(old.likely, content.likely)
			});
		}
	}
	diff.removed = [...byKey.values()];
	return diff;
}
