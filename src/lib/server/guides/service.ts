/**
 * The owner's guides: drafts anyone on the nursery's side may write, published only by the owner,
 * every save kept as a numbered revision (one transaction with the guide's row), any revision
 * restorable exactly. Markdown goes through the one sanitizing pipeline at save time; pages show
 * the stored HTML.
 */
import { compareTexts, slugify } from '../../board/guides';
import { findGuide, listGuides } from '../../guides';
import type { GuideInput } from '../../schema/guides';
import type { AuthUser } from '../auth';
import { UserFacingError } from '../errors';
import { markdownToText, renderMarkdown } from '../markdown';
import { uploads } from '../uploads';
import { guidesRepository as repo, type GuideRow, type GuideValues, type RevisionRow } from './repository';

type Author = Pick<AuthUser, 'id' | 'role'>;

/** PostgreSQL's unique-violation, by constraint, as the field a person can fix. */
function conflictField(e: unknown): { field: string; message: string } | null {
	const err = e as { code?: string; constraint_name?: string; cause?: { code?: string; constraint_name?: string } };
	const pg = err?.code ? err : err?.cause;
	if (pg?.code !== '23505') return null;
	if (pg.constraint_name === 'guides_slug_key') return { field: 'slug', message: 'Another guide already uses this web address' };
	if (pg.constraint_name === 'guides_replaces_published_key') {
		return { field: 'replaces', message: 'Another published guide already takes the place of this one: unpublish it or choose another' };
	}
	return null;
}

async function translatingConflicts<T>(work: () => Promise<T>): Promise<T> {
	try {
		return await work();
	} catch (e) {
		const c = conflictField(e);
		if (c) throw new UserFacingError(c.field, c.message, 409);
		throw e;
	}
}

function valuesOf(input: GuideInput, slug: string): GuideValues {
	return {
		slug,
		title: input.title,
		summary: input.summary,
		body: input.body,
		bodyHtml: renderMarkdown(input.body),
		bodyText: markdownToText(input.body),
		stages: [...new Set(input.stages)],
		groups: [...new Set(input.groups)],
		replaces: input.replaces || null
	};
}

function checkSlugAndReplaces(slug: string, replaces: string) {
	if (findGuide(slug)) throw new UserFacingError('slug', 'A built-in guide already uses this web address: choose another', 409);
	if (replaces && !findGuide(replaces)) throw new UserFacingError('replaces', 'Choose a built-in guide from the list', 400);
}

const revisionOf = (guideId: number, number: number, v: GuideValues, authorId: number, restoredFrom: number | null = null) => ({
	guideId,
	number,
	slug: v.slug,
	title: v.title,
	summary: v.summary,
	body: v.body,
	stages: v.stages,
	groups: v.groups,
	replaces: v.replaces,
	authorId,
	restoredFrom
});

async function editable(id: number, who: Author): Promise<GuideRow> {
	const guide = await repo.findById(id);
	if (!guide) throw new UserFacingError('form', 'No such guide', 404);
	if (guide.status === 'published' && who.role !== 'owner') {
		throw new UserFacingError('form', 'This guide is published: only the owner can change it', 403);
	}
	return guide;
}

export const guideService = {
	/** A new draft. Only the owner sets the web address; staff drafts take it from the title. */
	async create(input: GuideInput, who: Author, sourceQuestionId: number | null = null, now = new Date()): Promise<GuideRow> {
		const slug = who.role === 'owner' && input.slug ? input.slug : slugify(input.title);
		checkSlugAndReplaces(slug, input.replaces);
		const values = valuesOf(input, slug);
		return translatingConflicts(() =>
			repo.transaction(async (tx) => {
				const guide = await repo.insert({ ...values, authorId: who.id, sourceQuestionId }, tx);
				await repo.insertRevision({ ...revisionOf(guide.id, 1, values, who.id), createdAt: now }, tx);
				return guide;
			})
		);
	},

	/** Saves the form as the guide's next revision. */
	async save(id: number, input: GuideInput, who: Author, now = new Date()): Promise<void> {
		const current = await editable(id, who);
		const slug = who.role === 'owner' && input.slug ? input.slug : current.slug;
		checkSlugAndReplaces(slug, input.replaces);
		const values = valuesOf(input, slug);
		await translatingConflicts(() =>
			repo.transaction(async (tx) => {
				if (!(await repo.lockById(id, tx))) throw new UserFacingError('form', 'No such guide', 404);
				const number = (await repo.lastRevisionNumber(id, tx)) + 1;
				await repo.update(id, values, now, tx);
				await repo.insertRevision({ ...revisionOf(id, number, values, who.id), createdAt: now }, tx);
			})
		);
	},

	/** Brings back an earlier revision exactly, as a new revision (so nothing is lost). */
	async restore(id: number, revision: number, who: Author, now = new Date()): Promise<void> {
		await editable(id, who);
		await translatingConflicts(() =>
			repo.transaction(async (tx) => {
				if (!(await repo.lockById(id, tx))) throw new UserFacingError('form', 'No such guide', 404);
				const old = await repo.findRevision(id, revision, tx);
				if (!old) throw new UserFacingError('revision', 'No such revision of this guide', 404);
				const values: GuideValues = {
					slug: old.slug,
					title: old.title,
					summary: old.summary,
					body: old.body,
					bodyHtml: renderMarkdown(old.body),
					bodyText: markdownToText(old.body),
					stages: old.stages,
					groups: old.groups,
					replaces: old.replaces
				};
				const number = (await repo.lastRevisionNumber(id, tx)) + 1;
				await repo.update(id, values, now, tx);
				await repo.insertRevision({ ...revisionOf(id, number, values, who.id, old.number), createdAt: now }, tx);
			})
		);
	},

	async publish(id: number, who: Author, now = new Date()): Promise<void> {
		if (who.role !== 'owner') throw new UserFacingError('form', 'Only the owner publishes guides', 403);
		const guide = await repo.findById(id);
		if (!guide) throw new UserFacingError('form', 'No such guide', 404);
		await translatingConflicts(() => repo.update(id, { status: 'published', publishedAt: guide.publishedAt ?? now }, now));
	},

	async unpublish(id: number, who: Author, now = new Date()): Promise<void> {
		if (who.role !== 'owner') throw new UserFacingError('form', 'Only the owner publishes guides', 403);
		if (!(await repo.findById(id))) throw new UserFacingError('form', 'No such guide', 404);
		await repo.update(id, { status: 'draft' }, now);
	},

	/** Stores an image for a guide's text (owner and staff) and returns the Markdown that shows its display size. */
	async addImage(guideId: number, file: File | undefined, alt: string, who: Author): Promise<{ uploadId: number; markdown: string }> {
		if (who.role !== 'owner' && who.role !== 'staff') throw new UserFacingError('image', 'Only the nursery adds images to guides', 403);
		await editable(guideId, who);
		if (!file) throw new UserFacingError('image', 'Choose an image to add');
		const staged = await uploads.stage(file, 'image');
		try {
			const upload = await repo.transaction((tx) => uploads.record(tx, staged, { ownerId: who.id, purpose: 'guide-image', field: 'image' }));
			return { uploadId: upload.id, markdown: `![${alt.replace(/[[\]\\]/g, '')}](/uploads/${upload.id}/display)` };
		} catch (e) {
			await staged.discard();
			throw e;
		}
	},

	/** The nursery sees every guide image; everyone else only those a published guide shows. */
	async canSeeImage(viewer: Pick<Author, 'role'> | null, uploadId: number): Promise<boolean> {
		return viewer?.role === 'owner' || viewer?.role === 'staff' || repo.publishedGuideShows(uploadId);
	},

	async get(id: number): Promise<GuideRow | undefined> {
		return repo.findById(id);
	},

	listPage: (limit: number, offset: number) => repo.listPage(limit, offset),
	count: () => repo.count(),
	revisions: (id: number) => repo.listRevisions(id),

	/** A revision beside the one before it: which fields changed and the body line by line. */
	async compare(id: number, number: number) {
		const after = await repo.findRevision(id, number);
		if (!after) return null;
		const before: RevisionRow | undefined = number > 1 ? await repo.findRevision(id, number - 1) : undefined;
		const fields = (['title', 'summary', 'slug', 'replaces'] as const)
			.filter((f) => (before?.[f] ?? null) !== after[f])
			.map((f) => ({ field: f, before: before?.[f] ?? null, after: after[f] }));
		const tags = (['stages', 'groups'] as const)
			.filter((f) => (before?.[f] ?? []).join(',') !== after[f].join(','))
			.map((f) => ({ field: f, before: (before?.[f] ?? []).join(', ') || null, after: after[f].join(', ') || null }));
		return { after, before: before ?? null, fields: [...fields, ...tags], lines: compareTexts(before?.body ?? '', after.body) };
	},

	/** The built-in guides that a nursery guide may take the place of. */
	replaceable: () => listGuides().map((g) => ({ slug: g.slug, title: g.title })),

	// Public reads: published guides only.
	listPublished: () => repo.listPublished(),
	findPublished: (slug: string) => repo.findPublishedBySlug(slug),
	/** The nursery's own guide standing in for a built-in one, if the owner published one. */
	replacementFor: (builtInSlug: string) => repo.findPublishedReplacing(builtInSlug),
	replacements: async () => new Map((await repo.listReplacements()).map((r) => [r.replaces!, { slug: r.slug, title: r.title }]))
};
