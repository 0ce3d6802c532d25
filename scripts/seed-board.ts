/**
 * The demo scenario's guides and question board: two guides the owner of Kestrel Hollow Bananas
 * wrote and published, and two answered public questions from Marrowby gardeners, written through
 * the app's own services (the same sanitizing, revisions and search columns as in use). Runs once:
 * a database that already has the first demo guide is left as it is.
 */
import { eq } from 'drizzle-orm';
import { askSchema } from '../src/lib/schema/questions';
import { guideSchema } from '../src/lib/schema/guides';
import { DEMO_ACCOUNTS } from './demo.mjs';

const GUIDES = [
	{
		slug: 'shelter-from-the-wind',
		title: 'Shelter young plants from the wind',
		summary: 'Why leaves tear in a breeze, and a screen that keeps a young mat growing.',
		stages: ['planted', 'growing-leaves'],
		body: `## Why leaves tear

Banana leaves split along their side veins in any steady wind. A few splits do little harm; a torn-up crown on a young plant slows it down, because the leaves it relies on are the leaves it loses (common practice, no source).

## A screen that works

- Put the screen on the side the wind usually comes from, a little way out from the plant so leaves do not rub on it.
- Shade cloth or a woven fence lets some air through; a solid board makes the wind curl over and down onto the plant.
- Take the screen away once the pseudostem is about waist high and the plant stands on its own.

## Take care

Wear gloves when you drive stakes or cut cloth, and keep ladders and step-stools off soft, wet ground. Check local rules before putting up a fence on a boundary.`
	},
	{
		slug: 'propping-a-heavy-bunch',
		title: 'Propping a heavy bunch',
		summary: 'When a filling bunch starts to lean the stem over, and how to prop it safely.',
		stages: ['flowering', 'ready'],
		body: `## When to prop

A bunch gets heavier every week while it fills. If the pseudostem starts to lean, or the ground is soft after rain, prop it before it tips (common practice, no source).

## How

1. Use a forked pole or two poles tied into an X, a little taller than where the bunch hangs.
2. Set the fork against the stem just under the bunch, on the side it leans towards, and push the foot of the pole firmly into the ground.
3. Check the prop after every storm.

## Take care

A falling stem with a full bunch is heavy enough to hurt someone: never stand on the side it leans towards, and work with a second person. Wear gloves; the sap stains clothes and skin.`
	}
] as const;

const QUESTIONS = [
	{
		asker: 3,
		answerer: 1,
		title: 'Brown edges on the lowest leaves',
		body: 'My Grand Nain has been in the ground six weeks. The two lowest leaves have gone brown at the edges and droop. The new leaves look fine. Should I worry?',
		answer: 'Not yet. The lowest leaves are the oldest and the plant lets them go as it makes new ones, especially after planting out. Cut them off once they are fully brown, keep the soil moist but not wet, and start feeding after the second new leaf as your plan says. If the *new* leaves start browning, ask again with a photo.'
	},
	{
		asker: 4,
		answerer: 2,
		title: 'Three suckers at once: which one do I keep?',
		body: 'Three suckers have come up around my plant in the last month. The plan says to keep one or two as followers. How do I choose?',
		answer: 'Keep the sturdiest one with narrow, sword-shaped leaves, growing a hand or two away from the mother, ideally on the sunny side. Cut the others off at ground level and dig out their growing point. See the guide on followers and thinning for pictures of what to look for.'
	}
] as const;

export async function seedBoard(): Promise<void> {
	const { db } = await import('../src/lib/server/db');
	const { guides, users } = await import('../src/lib/server/db/schema');
	const { guideService } = await import('../src/lib/server/guides/service');
	const { boardService } = await import('../src/lib/server/board/service');
	if ((await db.select({ id: guides.id }).from(guides).where(eq(guides.slug, GUIDES[0].slug))).length > 0) return;
	const person = async (i: number) => {
		const [row] = await db.select({ id: users.id, role: users.role }).from(users).where(eq(users.email, DEMO_ACCOUNTS[i]!.email));
		return row!;
	};
	const owner = await person(0);
	for (const g of GUIDES) {
		const guide = await guideService.create(guideSchema.parse({ ...g, groups: [], replaces: '' }), owner);
		await guideService.publish(guide.id, owner);
	}
	for (const q of QUESTIONS) {
		const asker = await person(q.asker);
		const question = await boardService.ask(askSchema.parse({ title: q.title, body: q.body, isPublic: 'on' }), asker);
		// The demo's answers are already read: no e-mail.
		await boardService.answer(question.id, q.answer, await person(q.answerer), async () => undefined);
	}
}
