import { beforeAll, describe, expect, it } from 'vitest';
import { boardService } from '../../../src/lib/server/board/service';
import { guideService } from '../../../src/lib/server/guides/service';
import { searchService } from '../../../src/lib/server/search/service';
import { askSchema } from '../../../src/lib/schema/questions';
import { guideSchema } from '../../../src/lib/schema/guides';
import { person } from '../../helpers/people';

const noMail = async () => undefined; // the answer-mail queue, not needed here
const word = `zanzibarite${Date.now().toString(36)}`;
let publicId = 0;
let privateId = 0;

beforeAll(async () => {
	const [asker, staff, owner] = await Promise.all([person('gardener'), person('staff'), person('owner')]);
	const pub = await boardService.ask(askSchema.parse({ title: `Spots like ${word} on fingers`, body: 'Brown spots appeared on the fingers this week.', isPublic: 'on' }), asker);
	await boardService.answer(pub.id, 'Those are sugar spots: the fruit is ripe.', staff, noMail);
	const priv = await boardService.ask(askSchema.parse({ title: 'Private worry', body: `My ${word} neighbour says the stem is leaning.` }), asker);
	await boardService.answer(priv.id, 'Prop it.', staff, noMail);
	publicId = pub.id;
	privateId = priv.id;
	const g = await guideService.create(guideSchema.parse({ title: 'Our own ripening advice', summary: 'Ripen in the shade.', body: `Hang the bunch in shade; ${word} fingers colour evenly.`, replaces: 'ripening' }), owner);
	await guideService.publish(g.id, owner);
});

describe('search', () => {
	it('finds a public answered question and highlights the words, but not a private one', async () => {
		const r = await searchService.search(word, null);
		expect(r.questions.map((q) => q.id)).toEqual([publicId]);
		expect(r.questions[0].snippet.some((p) => p.hit && p.text.toLowerCase().includes('zanzibarite'))).toBe(true);
	});
	it('staff also find private questions', async () => {
		const r = await searchService.search(word, { role: 'staff' });
		expect(r.questions.map((q) => q.id).sort()).toEqual([publicId, privateId].sort());
	});
	it('matches words in answers, with stemming (fruit → fruits)', async () => {
		const r = await searchService.search('"sugar spots" fruits', null);
		expect(r.questions.map((q) => q.id)).toContain(publicId);
	});
	it('finds built-in guides, and the nursery guide instead of the one it replaces', async () => {
		const r = await searchService.search('bunch shade', null);
		const slugs = r.guides.map((g) => g.slug);
		expect(slugs).toContain('our-own-ripening-advice');
		expect(slugs).not.toContain('ripening');
		expect(r.guides.some((g) => g.origin === 'built-in')).toBe(true);
	});
	it('an excluded word removes the match; nonsense finds nothing without failing', async () => {
		expect((await searchService.search(`${word} -sugar -spots -brown -fingers`, null)).questions).toEqual([]);
		expect((await searchService.search('" & | ! : * ( ) <->', null)).questions).toEqual([]);
	});
});
