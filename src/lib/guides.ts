/**
 * The built-in guide library: one mdsvex page per guide in content/guides/<slug>.md, linked from
 * care-plan steps by slug (GUIDE_FOR in $lib/care/plan.ts). Frontmatter is checked when this module
 * loads, so a bad guide fails the build and the unit tests rather than a visitor's page.
 */
import type { Component } from 'svelte';
import { z } from 'zod';
import { PLANT_STAGES, type PlantStage } from '$lib/care';

// Defined beside the board's vocabulary so that schemas and scripts can use it without this
// module's build-time import of the Markdown files.
import { GUIDE_STAGES } from './board/vocabulary';
export { GUIDE_STAGES };
export type GuideStage = PlantStage;

export const guideFrontmatter = z
	.object({
		title: z.string().trim().min(1),
		summary: z
			.string()
			.trim()
			.min(1)
			.refine((s) => /[.!?]$/.test(s) && !/[.!?]\s+\S/.test(s), 'summary must be one sentence'),
		stage: z.enum(GUIDE_STAGES),
		order: z.number().int().nonnegative()
	})
	.strict();
export type GuideMeta = z.infer<typeof guideFrontmatter>;

export interface Guide extends GuideMeta {
	slug: string;
	/** The guide's body, rendered by mdsvex. */
	component: Component;
}

interface MdsvexModule {
	default: Component;
	metadata?: unknown;
}

const SLUG = /^[a-z0-9]+(?:-[a-z0-9]+)*$/;

/** Builds the library from glob results; throws on the first bad guide, naming its file. */
export function buildLibrary(modules: Record<string, MdsvexModule>): Guide[] {
	const guides = Object.entries(modules).map(([path, mod]) => {
		const slug = path.split('/').pop()!.replace(/\.md$/, '');
		if (!SLUG.test(slug)) throw new Error(`Guide ${path}: file name must be a lower-case slug`);
		const parsed = guideFrontmatter.safeParse(mod.metadata);
		if (!parsed.success) throw new Error(`Guide ${path}: bad frontmatter: ${z.prettifyError(parsed.error)}`);
		if (typeof mod.default !== 'function') throw new Error(`Guide ${path}: no rendered body`);
		return { ...parsed.data, slug, component: mod.default } satisfies Guide;
	});
	const orders = new Map<number, string>();
	for (const g of guides) {
		const clash = orders.get(g.order);
		if (clash) throw new Error(`Guides ${clash} and ${g.slug} share order ${g.order}`);
		orders.set(g.order, g.slug);
	}
	return guides.sort((a, b) => a.order - b.order);
}

// Vite (the app, its build and the tests) turns the glob into the compiled guides. Scripts run by
// plain Node through tsx (the demo seed, benchmarks) have no import.meta.env and no Markdown
// compiler: there the library is empty, which only means no built-in guide to collide with.
const library = buildLibrary(import.meta.env ? import.meta.glob<MdsvexModule>('/content/guides/*.md', { eager: true }) : {});

/** Every built-in guide, in reading order. */
export function listGuides(): Guide[] {
	return [...library];
}

export function findGuide(slug: string): Guide | undefined {
	return library.find((g) => g.slug === slug);
}

/** Guides in stage order, with empty stages left out. */
export function guidesByStage(guides: Guide[]): { stage: GuideStage; guides: Guide[] }[] {
	return GUIDE_STAGES.map((stage) => ({ stage, guides: guides.filter((g) => g.stage === stage) })).filter((s) => s.guides.length > 0);
}
