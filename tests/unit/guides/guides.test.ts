/**
 * The built-in guide library: one guide per slug a plan step links to, valid frontmatter, a
 * "Take care" section wherever the work can hurt someone, and the trade's rules of thumb in the text.
 */
import { readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { GUIDE_FOR } from '../../../src/lib/care/plan';
import { PLANT_STAGE_IDS } from '../../../src/lib/care/stages';
import { BORROWED_STAGE_GUIDES, GUIDE_FOR_STAGE } from '../../../src/lib/stage-guides';
import { GUIDE_STAGES, buildLibrary, findGuide, guideFrontmatter, guidesByStage, listGuides } from '../../../src/lib/guides';

const DIR = join(process.cwd(), 'content/guides');
const files = readdirSync(DIR).filter((f) => f.endsWith('.md'));
const raw = Object.fromEntries(files.map((f) => [f.replace(/\.md$/, ''), readFileSync(join(DIR, f), 'utf8')]));
/** The markdown after the frontmatter. */
const body = (slug: string) => raw[slug].replace(/^---\n[\s\S]*?\n---\n/, '');
const text = (slug: string) => body(slug).replace(/[*_`#|]/g, '').replace(/\s+/g, ' ');
const slugs = [...new Set(Object.values(GUIDE_FOR))];

describe('guide library', () => {
	it('has a guide for every slug a plan step links to', () => {
		for (const slug of slugs) expect(findGuide(slug), slug).toBeDefined();
	});
	it('has no guide that no step links to', () => {
		expect(listGuides().map((g) => g.slug).sort()).toEqual([...slugs].sort());
	});
	it('links every plant stage to an existing guide, filed under that stage unless the stage has none', () => {
		for (const stage of PLANT_STAGE_IDS) {
			const guide = findGuide(GUIDE_FOR_STAGE[stage]);
			expect(guide, stage).toBeDefined();
			const own = listGuides().filter((g) => g.stage === stage);
			if (BORROWED_STAGE_GUIDES.includes(stage)) expect(own, stage).toEqual([]);
			else expect(guide!.stage, stage).toBe(stage);
		}
	});
	it('lists guides by order, with distinct orders', () => {
		const orders = listGuides().map((g) => g.order);
		expect(orders).toEqual([...orders].sort((a, b) => a - b));
		expect(new Set(orders).size).toBe(orders.length);
	});
	it('every guide has valid frontmatter and a rendered body', () => {
		for (const g of listGuides()) {
			expect(guideFrontmatter.safeParse({ title: g.title, summary: g.summary, stage: g.stage, order: g.order }).success, g.slug).toBe(true);
			expect(typeof g.component, g.slug).toBe('function');
		}
	});
	it('unknown slugs find nothing', () => {
		expect(findGuide('no-such-guide')).toBeUndefined();
		expect(findGuide('')).toBeUndefined();
	});
	it('groups guides by stage in life order', () => {
		const groups = guidesByStage(listGuides());
		expect(groups.map((s) => s.stage)).toEqual(GUIDE_STAGES.filter((st) => listGuides().some((g) => g.stage === st)));
		expect(groups.flatMap((s) => s.guides).length).toBe(listGuides().length);
	});
	it('fails loudly on a bad guide', () => {
		const body = () => null;
		const good = { title: 'T', summary: 'One sentence.', stage: 'cut-back', order: 1 };
		expect(() => buildLibrary({ '/content/guides/x.md': { default: body as never, metadata: good } })).not.toThrow();
		expect(() => buildLibrary({ '/content/guides/x.md': { default: body as never, metadata: { ...good, stage: 'spring' } } })).toThrow(/x\.md/);
		expect(() => buildLibrary({ '/content/guides/x.md': { default: body as never, metadata: { ...good, order: 'first' } } })).toThrow(/x\.md/);
		expect(() => buildLibrary({ '/content/guides/x.md': { default: body as never, metadata: { ...good, summary: 'One. Two.' } } })).toThrow(/x\.md/);
		expect(() => buildLibrary({ '/content/guides/x.md': { default: body as never } })).toThrow(/x\.md/);
		expect(() =>
			buildLibrary({
				'/content/guides/a.md': { default: body as never, metadata: good },
				'/content/guides/b.md': { default: body as never, metadata: good }
			})
		).toThrow(/share order/);
	});
});

describe('guide texts', () => {
	for (const slug of slugs) {
		it(`${slug}: 250–500 words of body, ends with the deference line`, () => {
			const words = text(slug).trim().split(' ').length;
			expect(words).toBeGreaterThanOrEqual(250);
			expect(words).toBeLessThanOrEqual(500);
			expect(body(slug).trim().split('\n').pop()).toMatch(/general guidance.*local rules, product labels and licensed practice come first/i);
		});
	}
	for (const slug of ['division', 'harvest', 'feeding', 'after-harvest', 'followers-and-thinning']) {
		it(`${slug} has a "Take care" section`, () => {
			expect(body(slug)).toMatch(/^## Take care\n\n- /m);
		});
	}
});

describe("the trade's key numbers are in the guides (common practice, no source)", () => {
	const all = slugs.map(text).join(' ');
	it('planting: pot depth, own soil, full sun, moist to the touch', () => {
		expect(text('planting')).toMatch(/as deep as the pot/);
		expect(text('planting')).toMatch(/soil that came out/);
		expect(text('planting')).toMatch(/full sun/i);
		expect(text('planting')).toMatch(/moist to the touch/);
	});
	it('feeding: two new leaves, handful → half a 2-lb can → full can monthly, per mat, high potassium, local bans', () => {
		const t = text('feeding');
		expect(t).toMatch(/two new leaves/);
		expect(t).toMatch(/a handful/);
		expect(t).toMatch(/half of a 2-lb can/);
		expect(t).toMatch(/full 2-lb can/);
		expect(t).toMatch(/Every month from then on/);
		expect(t).toMatch(/by the mat, not by the plant/);
		expect(t).toMatch(/twice the first/);
		expect(t).toMatch(/June 1 to September 30/);
	});
	it('followers: about 6 months, sword over water suckers, at most four, two per mat commercially', () => {
		const t = text('followers-and-thinning');
		expect(t).toMatch(/about 6 months/);
		expect(t).toMatch(/sword suckers/i);
		expect(t).toMatch(/water suckers/i);
		expect(t).toMatch(/at most four/);
		expect(t).toMatch(/two per mat/);
	});
	it('division: waist height, new hole first, quarantine diseases', () => {
		const t = text('division');
		expect(t).toMatch(/waist height/);
		expect(t).toMatch(/Dig the new hole first/);
		expect(t).toMatch(/bunchy top/);
		expect(t).toMatch(/TR4/);
		expect(t).toMatch(/local agriculture department/);
	});
	it('flowering: about 12 months, 50–60 leaves, flag leaf, mark the date', () => {
		const t = text('flowering');
		expect(t).toMatch(/about 12 months/);
		expect(t).toMatch(/50–60 leaves/);
		expect(t).toMatch(/flag leaf/);
		expect(t).toMatch(/date the flower emerges/i);
		expect(t).toMatch(/prop it/i);
	});
	it('harvest: about 4 months, 85–110 days, up to about 7 months, two people', () => {
		const t = text('harvest');
		expect(t).toMatch(/about 4 months after the flower emerges/);
		expect(t).toMatch(/85–110 days/);
		expect(t).toMatch(/up to about 7 months/);
		expect(t).toMatch(/lost their angles/);
		expect(t).toMatch(/second person|in twos/i);
		expect(t).toMatch(/tens of kilograms/);
	});
	it('ripening: upside down, cool shade, never below 13 °C, fan → air conditioning → freeze', () => {
		const t = text('ripening');
		expect(t).toMatch(/upside down/);
		expect(t).toMatch(/cool shade with moving air/);
		expect(t).toMatch(/below 13 °C/);
		const fan = t.indexOf('by a fan');
		const ac = t.indexOf('air conditioning');
		const freeze = t.indexOf('Peel and freeze');
		expect(fan).toBeGreaterThan(0);
		expect(ac).toBeGreaterThan(fan);
		expect(freeze).toBeGreaterThan(ac);
	});
	it('after harvest: 1.2 m (4 ft), about 2 weeks later at ground level, 16–17 months', () => {
		const t = text('after-harvest');
		expect(t).toMatch(/1\.2 m \(4 ft\)/);
		expect(t).toMatch(/About 2 weeks later/);
		expect(t).toMatch(/ground level/);
		expect(t).toMatch(/16–17 months/);
	});
	it('timing follows the plant, and cooler gardens are slower', () => {
		expect(all).toMatch(/not from the time of year|not the season/);
		expect(all).toMatch(/cooler garden/);
	});
});
