/** Rules of the guide library that need no database: slugs, the combined listing, revision diffs. */
import { diffLines } from 'diff';
import { PLANT_STAGE_IDS, stageLabel, type PlantStage } from '../care';

/** A web address made from a title: "Feeding in a cold winter!" → "feeding-in-a-cold-winter". */
export function slugify(title: string, max = 80): string {
	const slug = title
		.normalize('NFKD')
		.replace(/[\u0300-\u036f]/g, '')
		.toLowerCase()
		.replace(/[^a-z0-9]+/g, '-')
		.replace(/^-+|-+$/g, '')
		.slice(0, max)
		.replace(/-+$/, '');
	return slug.length >= 2 ? slug : `guide-${slug || 'untitled'}`;
}

/** One entry in the public list, whichever library it comes from. */
export interface ListedGuide {
	slug: string;
	title: string;
	summary: string;
	stages: string[];
	groups: string[];
	/** 'built-in' ships with Bunchline; 'nursery' was written by the owner. */
	origin: 'built-in' | 'nursery';
	/** Built-in guides' reading order; the nursery's own come after, newest first. */
	order: number;
}

export interface GuideFilter {
	stage?: string;
	group?: string;
}

/**
 * Built-in and nursery guides in one list. A nursery guide that takes the place of a built-in one
 * stands where that one stood; a guide with no cultivar group applies to every group.
 */
export function combineGuides(builtIn: ListedGuide[], nursery: (ListedGuide & { replaces: string | null })[], filter: GuideFilter): ListedGuide[] {
	const replaced = new Map(nursery.filter((g) => g.replaces).map((g) => [g.replaces!, g]));
	const merged: ListedGuide[] = [
		...builtIn.map((g) => {
			const own = replaced.get(g.slug);
			return own ? { ...own, order: g.order, stages: own.stages.length ? own.stages : g.stages } : g;
		}),
		...nursery.filter((g) => !g.replaces || !builtIn.some((b) => b.slug === g.replaces))
	];
	return merged
		.filter((g) => !filter.stage || g.stages.includes(filter.stage))
		.filter((g) => !filter.group || g.groups.length === 0 || g.groups.includes(filter.group))
		.sort((a, b) => a.order - b.order);
}

export interface DiffLine {
	change: 'added' | 'removed' | 'same';
	text: string;
}

/** Line-by-line changes from one revision's text to the next's (jsdiff's Myers diff). */
export function compareTexts(before: string, after: string): DiffLine[] {
	return diffLines(before, after).flatMap((part) => {
		const change = part.added ? 'added' : part.removed ? 'removed' : 'same';
		return part.value.replace(/\n$/, '').split('\n').map((text) => ({ change, text }) as DiffLine);
	});
}

/** A stage tag as people read it ("Growing leaves"); a tag no longer in the vocabulary shows as stored. */
export function stageName(tag: string): string {
	return (PLANT_STAGE_IDS as string[]).includes(tag) ? stageLabel(tag as PlantStage) : tag;
}
