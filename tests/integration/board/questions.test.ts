import { count, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { consume } from '../../../src/lib/server/auth';
import { boardService, postingKeys } from '../../../src/lib/server/board/service';
import { db } from '../../../src/lib/server/db';
import { guides, questionPosts, questions } from '../../../src/lib/server/db/schema';
import { UserFacingError } from '../../../src/lib/server/errors';
import type { Message } from '../../../src/lib/server/mail';
import { runAnswerMailJob, type AnswerMailJob } from '../../../src/lib/server/board/mail';
import { uploads as uploadService } from '../../../src/lib/server/uploads';
import { questionPhotos, uploads } from '../../../src/lib/server/db/schema';
import { gpsOf, phonePhotoWithGps, scriptAsJpeg } from '../../helpers/images';
import { POSTING_LIMITS } from '../../../src/lib/board/vocabulary';
import { askSchema } from '../../../src/lib/schema/questions';
import { person, plantOf } from '../../helpers/people';

type P = Awaited<ReturnType<typeof person>>;
let asker: P, other: P, staff: P, staff2: P, owner: P;
let plantId = 0;
const today = '2026-12-01';

beforeAll(async () => {
	[asker, other, staff, staff2, owner] = await Promise.all([person('gardener', 'Pim Okonedo'), person('gardener'), person('staff'), person('staff', 'Teo Marchetti-Lowe'), person('owner')]);
	plantId = await plantOf(asker.id, { stage: 'growing-leaves', nextStepKind: 'feeding', nextStepOn: '2026-12-10' });
});

const ask = (over: Record<string, unknown> = {}, who: P = asker) =>
	boardService.ask(askSchema.parse({ title: 'Yellow edges on new leaves', body: 'The newest leaf has yellow edges since last week.', ...over }), who);

async function refusal(p: Promise<unknown>): Promise<UserFacingError> {
	const e = await p.then(() => null, (err) => err);
	expect(e).toBeInstanceOf(UserFacingError);
	return e as UserFacingError;
}

function mailbox() {
	const sent: Message[] = [];
	return { sent, mail: async (m: Message) => void sent.push(m) };
}

/** Stands in for the job queue: keeps the jobs an answer asks for. */
function queue() {
	const jobs: AnswerMailJob[] = [];
	return { jobs, mail: async (job: AnswerMailJob) => void jobs.push(job) };
}

const photoFile = async (name = 'leaf.jpg') => new File([new Uint8Array(await phonePhotoWithGps(640, 480))], name, { type: 'image/jpeg' });

describe('asking', () => {
	it('a question about the asker’s own plant is private and waiting', async () => {
		const q = await ask({ plantId: String(plantId) });
		expect([q.state, q.isPublic, q.plantId]).toEqual(['waiting', false, plantId]);
	});
	it('another gardener’s plant is refused as not found, and nothing is written', async () => {
		const before = (await db.select({ n: count() }).from(questions))[0].n;
		const e = await refusal(ask({ plantId: String(plantId) }, other));
		expect([e.field, e.status]).toEqual(['plantId', 404]);
		expect((await db.select({ n: count() }).from(questions))[0].n).toBe(before);
	});
	it('is limited per account', async () => {
		const spammer = await person('gardener');
		for (let i = 0; i < POSTING_LIMITS.questionsPerAccount.limit; i++) await consume(postingKeys.question(spammer.id), POSTING_LIMITS.questionsPerAccount);
		expect((await refusal(ask({}, spammer))).status).toBe(429);
	});
});

describe('who sees what', () => {
	it('a private question is 404 for other gardeners and visitors, visible to its asker and staff', async () => {
		const q = await ask();
		expect((await refusal(boardService.view(q.id, other, today))).status).toBe(404);
		expect((await refusal(boardService.view(q.id, null, today))).status).toBe(404);
		expect((await boardService.view(q.id, asker, today)).question.id).toBe(q.id);
		expect((await boardService.view(q.id, staff, today)).question.id).toBe(q.id);
		for (const act of [
			() => boardService.reply(q.id, 'me too', other),
			() => boardService.resolve(q.id, other),
			() => boardService.accept(q.id, 1, other),
			() => boardService.remove(q.id, other)
		]) {
			expect((await refusal(act())).status).toBe(404);
		}
		expect((await boardService.view(q.id, asker, today)).posts).toEqual([]);
	});
	it('a public question shows to everyone once answered, never while waiting or hidden', async () => {
		const q = await ask({ isPublic: 'on' });
		expect((await refusal(boardService.view(q.id, null, today))).status).toBe(404);
		await boardService.answer(q.id, 'Magnesium: feed as planned.', staff, queue().mail);
		expect((await boardService.view(q.id, null, today)).posts).toHaveLength(1);
		expect((await boardService.view(q.id, null, today)).plant).toBeNull();
		await boardService.setState(q.id, 'hidden', staff);
		expect((await refusal(boardService.view(q.id, null, today))).status).toBe(404);
		expect((await refusal(boardService.view(q.id, asker, today))).status).toBe(404);
	});
});

describe('the staff side', () => {
	it('the queue is longest-waiting first with the plant beside it', async () => {
		const first = await ask({ plantId: String(plantId) });
		await db.update(questions).set({ waitingSince: new Date('2020-01-01T00:00:00Z') }).where(eq(questions.id, first.id));
		const [top] = await boardService.queue(['waiting'], 5, 0);
		expect(top.id).toBe(first.id);
		expect([top.stage, top.nextStepKind, top.plantedOn]).toEqual(['growing-leaves', 'feeding', '2026-03-08']);
	});
	it('a claim keeps others from answering until it is released', async () => {
		const q = await ask();
		await boardService.claim(q.id, staff);
		expect((await refusal(boardService.claim(q.id, staff2))).status).toBe(409);
		expect((await refusal(boardService.answer(q.id, 'x', staff2, queue().mail))).status).toBe(409);
		await boardService.release(q.id, staff);
		await boardService.claim(q.id, staff2);
	});
	it('an answer is stored sanitized, marks the question answered and queues the e-mail; the worker sends the asker a link', async () => {
		const q = await ask();
		const queued = queue();
		const { mailed } = await boardService.answer(q.id, 'Feed it. <img src=x onerror=alert(1)>', staff, queued.mail);
		expect(mailed).toBe(true);
		const [row] = await db.select().from(questions).where(eq(questions.id, q.id));
		expect(row.state).toBe('answered');
		const [post] = await db.select().from(questionPosts).where(eq(questionPosts.questionId, q.id));
		expect(post.bodyHtml).not.toMatch(/<img/);
		expect(queued.jobs).toEqual([{ questionId: q.id }]);
		const box = mailbox();
		await runAnswerMailJob(queued.jobs[0], box.mail);
		expect(box.sent).toHaveLength(1);
		expect(box.sent[0].to).toBe(asker.email);
		expect(box.sent[0].text).toMatch(new RegExp(`/questions/${q.id}\\b`));
	});
	it('an answer stands when the queue cannot be reached, and a send that fails is thrown for the queue to retry', async () => {
		const q = await ask();
		const { mailed } = await boardService.answer(q.id, 'Water less.', staff, async () => {
			throw new Error('queue down');
		});
		expect(mailed).toBe(false);
		expect((await db.select().from(questions).where(eq(questions.id, q.id)))[0].state).toBe('answered');
		await expect(runAnswerMailJob({ questionId: q.id }, async () => Promise.reject(new Error('mail down')))).rejects.toThrow('mail down');
	});
	it('a hidden or deleted question sends no answer e-mail', async () => {
		const q = await ask();
		await boardService.answer(q.id, 'Spam answer.', staff, queue().mail);
		await boardService.setState(q.id, 'hidden', staff);
		const box = mailbox();
		await runAnswerMailJob({ questionId: q.id }, box.mail);
		await runAnswerMailJob({ questionId: 2_000_000_000 }, box.mail);
		expect(box.sent).toEqual([]);
	});
});

describe('the asker', () => {
	it('replies (back to the queue), accepts an answer (resolved) and deletes the question', async () => {
		const q = await ask();
		await boardService.answer(q.id, 'First answer.', staff, queue().mail);
		await boardService.reply(q.id, 'Still yellow.', asker);
		expect((await db.select().from(questions).where(eq(questions.id, q.id)))[0].state).toBe('waiting');
		await boardService.answer(q.id, 'Second answer.', staff, queue().mail);
		const answers = (await boardService.view(q.id, asker, today)).posts.filter((p) => p.kind === 'answer');
		const reply = (await boardService.view(q.id, asker, today)).posts.find((p) => p.kind === 'reply')!;
		expect((await refusal(boardService.accept(q.id, reply.id, asker))).field).toBe('postId');
		await boardService.accept(q.id, answers[1].id, asker);
		const v = await boardService.view(q.id, asker, today);
		expect(v.question.state).toBe('resolved');
		expect(v.posts.filter((p) => p.accepted).map((p) => p.id)).toEqual([answers[1].id]);
		await boardService.remove(q.id, asker);
		expect(await db.select().from(questions).where(eq(questions.id, q.id))).toEqual([]);
		expect(await db.select().from(questionPosts).where(eq(questionPosts.questionId, q.id))).toEqual([]);
	});
});

describe('from answer to guide', () => {
	it('the owner turns an answer into a draft guide; staff cannot', async () => {
		const q = await ask();
		await boardService.answer(q.id, '## Why\n\nMagnesium runs short in cold soil.', staff, queue().mail);
		const [post] = (await boardService.view(q.id, owner, today)).posts;
		expect((await refusal(boardService.toGuide(q.id, post.id, staff))).status).toBe(403);
		const g = await boardService.toGuide(q.id, post.id, owner);
		const [row] = await db.select().from(guides).where(eq(guides.id, g.id));
		expect([row.status, row.title, row.body, row.sourceQuestionId]).toEqual(['draft', q.title, '## Why\n\nMagnesium runs short in cold soil.', q.id]);
		expect(row.summary).toBe('The newest leaf has yellow edges since last week.');
	});
});

describe('photos', () => {
	// A gardener of its own, so the posting limit counts only these questions.
	let asker: P;
	beforeAll(async () => {
		asker = await person('gardener', 'Ola Brightwater');
	});
	it('up to four go with a question and one with an answer; only those who may see the question see them', async () => {
		const q = await boardService.ask(askSchema.parse({ title: 'Spots on the bunch', body: 'Brown spots on the fingers since Tuesday.' }), asker, [await photoFile(), await photoFile()]);
		await boardService.answer(q.id, 'Those are sugar spots.', staff, queue().mail, [await photoFile()]);
		const v = await boardService.view(q.id, asker, today);
		expect(v.photos).toHaveLength(2);
		expect(v.posts[0].photos).toHaveLength(1);
		const [first] = v.photos;
		const [row] = await db.select().from(uploads).where(eq(uploads.id, first.uploadId));
		expect(row.purpose).toBe('question-photo');
		// Stored re-encoded: the phone's GPS position is gone.
		expect(gpsOf((await uploadService.read(row, 'display'))!)).toBeUndefined();
		expect(await boardService.canSeePhoto(asker, first.uploadId)).toBe(true);
		expect(await boardService.canSeePhoto(staff, v.posts[0].photos[0].uploadId)).toBe(true);
		expect(await boardService.canSeePhoto(other, first.uploadId)).toBe(false);
		expect(await boardService.canSeePhoto(null, v.posts[0].photos[0].uploadId)).toBe(false);
	});
	it('a public answered question shows its photos to visitors, a hidden one to nobody but staff', async () => {
		const q = await boardService.ask(askSchema.parse({ title: 'Is this bunch ready?', body: 'The fingers are round and pale.', isPublic: 'on' }), asker, [await photoFile()]);
		const [photo] = (await boardService.view(q.id, asker, today)).photos;
		expect(await boardService.canSeePhoto(null, photo.uploadId)).toBe(false);
		await boardService.answer(q.id, 'Another week.', staff, queue().mail);
		expect(await boardService.canSeePhoto(null, photo.uploadId)).toBe(true);
		expect(await boardService.canSeePhoto(other, photo.uploadId)).toBe(true);
		await boardService.setState(q.id, 'hidden', staff);
		expect(await boardService.canSeePhoto(null, photo.uploadId)).toBe(false);
		expect(await boardService.canSeePhoto(staff, photo.uploadId)).toBe(true);
	});
	it('five photos, or one that is not an image, are refused by field and nothing is written', async () => {
		const before = (await db.select({ n: count() }).from(questions))[0].n;
		const uploadsBefore = (await db.select({ n: count() }).from(uploads))[0].n;
		const input = askSchema.parse({ title: 'Too many photos', body: 'Five photos of the same leaf.' });
		const five = await Promise.all([1, 2, 3, 4, 5].map(() => photoFile()));
		expect((await refusal(boardService.ask(input, asker, five))).field).toBe('photos');
		const script = new File([new Uint8Array(scriptAsJpeg())], 'leaf.jpg', { type: 'image/jpeg' });
		expect((await refusal(boardService.ask(input, asker, [await photoFile(), script]))).field).toBe('photos');
		expect((await db.select({ n: count() }).from(questions))[0].n).toBe(before);
		expect((await db.select({ n: count() }).from(uploads))[0].n).toBe(uploadsBefore);
	});
	it('deleting a question deletes its photos and their files', async () => {
		const q = await boardService.ask(askSchema.parse({ title: 'Photo to delete', body: 'This question goes away.' }), asker, [await photoFile()]);
		const [photo] = (await boardService.view(q.id, asker, today)).photos;
		const [row] = await db.select().from(uploads).where(eq(uploads.id, photo.uploadId));
		await boardService.remove(q.id, asker);
		expect(await db.select().from(uploads).where(eq(uploads.id, photo.uploadId))).toEqual([]);
		expect(await db.select().from(questionPhotos).where(eq(questionPhotos.questionId, q.id))).toEqual([]);
		expect(await uploadService.read(row, 'display')).toBeNull();
	});
});
