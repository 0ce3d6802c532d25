import { count, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { guideRevisions, guides } from '../../../src/lib/server/db/schema';
import { UserFacingError } from '../../../src/lib/server/errors';
import { guideService } from '../../../src/lib/server/guides/service';
import { GUIDE_STAGES } from '../../../src/lib/guides';
import { guideSchema, type GuideInput } from '../../../src/lib/schema/guides';
import { phonePhotoWithGps } from '../../helpers/images';
import { person } from '../../helpers/people';

let owner: Awaited<ReturnType<typeof person>>;
let staff: Awaited<ReturnType<typeof person>>;
beforeAll(async () => {
	[owner, staff] = await Promise.all([person('owner'), person('staff')]);
});

let n = 0;
const input = (over: Partial<Record<keyof GuideInput, unknown>> = {}): GuideInput =>
	guideSchema.parse({ title: `Mulching the mat ${++n}`, summary: 'Keep the roots cool and moist.', body: '## Why\n\nMulch keeps water in.', stages: [GUIDE_STAGES[0]], ...over });

async function refusal(p: Promise<unknown>): Promise<UserFacingError> {
	const e = await p.then(() => null, (err) => err);
	expect(e).toBeInstanceOf(UserFacingError);
	return e as UserFacingError;
}
const rows = async () => ({
	guides: (await db.select({ n: count() }).from(guides))[0].n,
	revisions: (await db.select({ n: count() }).from(guideRevisions))[0].n
});

describe('owner guides', () => {
	it('a new guide is a draft with revision 1, its HTML sanitized and its slug from the title', async () => {
		const g = await guideService.create(input({ body: 'Hi <script>alert(1)</script>' }), staff);
		expect(g.status).toBe('draft');
		expect(g.slug).toMatch(/^mulching-the-mat-\d+$/);
		expect(g.bodyHtml).not.toContain('<script');
		expect((await guideService.revisions(g.id)).map((r) => r.number)).toEqual([1]);
	});

	it('staff cannot choose the web address; the owner can', async () => {
		const byStaff = await guideService.create(input({ slug: 'staff-choice' }), staff);
		expect(byStaff.slug).not.toBe('staff-choice');
		const slug = `owner-choice-${Date.now().toString(36)}`;
		const byOwner = await guideService.create(input({ slug }), owner);
		expect(byOwner.slug).toBe(slug);
	});

	it('every save is a revision, and restoring one brings it back exactly', async () => {
		const g = await guideService.create(input({ body: 'First text\n\nwith  two  spaces\n' }), owner);
		const second = input({ title: 'Second title', body: 'Second text', stages: [GUIDE_STAGES[GUIDE_STAGES.length - 1]], groups: ['AAB'], slug: `second-${n}` });
		await guideService.save(g.id, second, owner);
		await guideService.save(g.id, input({ title: 'Third title', body: 'Third', slug: `third-${n}` }), owner);
		await guideService.restore(g.id, 1, owner);
		const [back] = await db.select().from(guides).where(eq(guides.id, g.id));
		const [first] = await db.select().from(guideRevisions).where(eq(guideRevisions.guideId, g.id)).orderBy(guideRevisions.number).limit(1);
		expect({ title: back.title, summary: back.summary, body: back.body, slug: back.slug, stages: back.stages, groups: back.groups, replaces: back.replaces }).toEqual({
			title: first.title,
			summary: first.summary,
			body: first.body,
			slug: first.slug,
			stages: first.stages,
			groups: first.groups,
			replaces: first.replaces
		});
		expect(back.body).toBe('First text\n\nwith  two  spaces\n');
		const revs = await guideService.revisions(g.id);
		expect(revs.map((r) => r.number)).toEqual([4, 3, 2, 1]);
		expect(revs[0].restoredFrom).toBe(1);
		const cmp = await guideService.compare(g.id, 2);
		expect(cmp!.fields.map((f) => f.field)).toEqual(expect.arrayContaining(['title', 'slug', 'stages', 'groups']));
		expect(cmp!.lines).toContainEqual({ change: 'added', text: 'Second text' });
	});

	it('only the owner publishes; staff cannot change a published guide', async () => {
		const g = await guideService.create(input(), staff);
		expect((await refusal(guideService.publish(g.id, staff))).status).toBe(403);
		await guideService.publish(g.id, owner);
		expect((await guideService.findPublished(g.slug))?.id).toBe(g.id);
		const before = await rows();
		expect((await refusal(guideService.save(g.id, input(), staff))).status).toBe(403);
		expect((await refusal(guideService.restore(g.id, 1, staff))).status).toBe(403);
		expect((await refusal(guideService.unpublish(g.id, staff))).status).toBe(403);
		expect(await rows()).toEqual(before);
	});

	it('refuses a slug taken by a built-in or another guide, writing nothing', async () => {
		const before = await rows();
		expect((await refusal(guideService.create(input({ slug: 'feeding' }), owner))).field).toBe('slug');
		const g = await guideService.create(input({ slug: `taken-${n}` }), owner);
		const after = await rows();
		const e = await refusal(guideService.create(input({ slug: g.slug }), owner));
		expect([e.field, e.status]).toEqual(['slug', 409]);
		expect(await rows()).toEqual(after);
		expect(after.guides).toBe(before.guides + 1);
	});

	it('one published guide at a time takes the place of a built-in one', async () => {
		const a = await guideService.create(input({ replaces: 'harvest' }), owner);
		const b = await guideService.create(input({ replaces: 'harvest' }), owner);
		await guideService.publish(a.id, owner);
		expect((await guideService.replacementFor('harvest'))?.slug).toBe(a.slug);
		const e = await refusal(guideService.publish(b.id, owner));
		expect([e.field, e.status]).toEqual(['replaces', 409]);
		expect((await refusal(guideService.create(input({ replaces: 'not-a-guide' }), owner))).field).toBe('replaces');
		await guideService.unpublish(a.id, owner);
		expect(await guideService.replacementFor('harvest')).toBeUndefined();
	});

	it('a missing guide is a 404', async () => {
		expect((await refusal(guideService.save(999_999, input(), owner))).status).toBe(404);
		expect((await refusal(guideService.publish(999_999, owner))).status).toBe(404);
		expect(await guideService.compare(999_999, 1)).toBeNull();
	});
});

describe('images in a guide', () => {
	const image = async () => new File([new Uint8Array(await phonePhotoWithGps(400, 300))], 'mat.jpg', { type: 'image/jpeg' });

	it('staff add one to a draft; visitors see it only once a published guide shows it', async () => {
		const g = await guideService.create(input(), staff);
		const { uploadId, markdown } = await guideService.addImage(g.id, await image(), 'A mulched mat [wide]', staff);
		expect(markdown).toBe(`![A mulched mat wide](/uploads/${uploadId}/display)`);
		await guideService.save(g.id, input({ title: g.title, body: `## Mulch\n\n${markdown}` }), staff);
		expect((await guideService.get(g.id))!.bodyHtml).toContain(`src="/uploads/${uploadId}/display"`);
		expect(await guideService.canSeeImage(null, uploadId)).toBe(false);
		expect(await guideService.canSeeImage({ role: 'gardener' }, uploadId)).toBe(false);
		expect(await guideService.canSeeImage(staff, uploadId)).toBe(true);
		await guideService.publish(g.id, owner);
		expect(await guideService.canSeeImage(null, uploadId)).toBe(true);
		// Another upload's id that merely starts with the same digits is not shown by this guide.
		expect(await guideService.canSeeImage(null, Number(`${uploadId}0`))).toBe(false);
	});

	it('a gardener cannot add one, staff cannot add one to a published guide, and no file is refused by field', async () => {
		const gardener = await person('gardener');
		const g = await guideService.create(input(), owner);
		expect((await refusal(guideService.addImage(g.id, await image(), 'x', gardener))).status).toBe(403);
		expect((await refusal(guideService.addImage(g.id, undefined, 'x', owner))).field).toBe('image');
		await guideService.publish(g.id, owner);
		expect((await refusal(guideService.addImage(g.id, await image(), 'x', staff))).status).toBe(403);
		expect((await refusal(guideService.addImage(999_999, await image(), 'x', owner))).status).toBe(404);
	});
});
