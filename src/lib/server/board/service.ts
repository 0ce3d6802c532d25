/**
 * The question board's rules. A gardener asks (optionally about one of their plants), staff claim
 * and answer from a queue ordered by waiting time, the asker is e-mailed, replies, accepts or
 * resolves; the owner can turn an answer into a draft guide. Anyone who may not see a question
 * gets the same 404 as for a missing one, so ids reveal nothing.
 */
import { canSee, summaryFrom } from '../../board/questions';
import { BOARD_BOUNDS, POSTING_LIMITS, type QuestionState } from '../../board/vocabulary';
import type { AskInput } from '../../schema/questions';
import { consume, type AuthUser } from '../auth';
import { UserFacingError } from '../errors';
import { guideService } from '../guides/service';
import { enqueue, QUEUES } from '../jobs';
import { markdownToText, renderMarkdown } from '../markdown';
import { uploads, type StagedUpload } from '../uploads';
import type { AnswerMailJob } from './mail';
import { boardRepository as repo, type QuestionRow } from './repository';

type Person = Pick<AuthUser, 'id' | 'role'>;
const isStaff = (p: Person) => p.role === 'owner' || p.role === 'staff';
const notFound = () => new UserFacingError('form', 'No such question', 404);

export const postingKeys = {
	question: (userId: number) => `question:${userId}`,
	reply: (userId: number) => `reply:${userId}`
};

/** Asks for the answer e-mail; the worker sends it (./mail.ts), so the answer never waits on the mail server. */
export type AnswerNotifier = (job: AnswerMailJob) => Promise<unknown>;
export const queueAnswerMail: AnswerNotifier = (job) => enqueue(QUEUES.answerMail, job);

/**
 * Checks and stores up to four photos before any row is written (refusals name `field`), runs
 * `work` in one transaction with their upload rows, and removes the files if it fails.
 */
async function withPhotos<T>(
	photos: File[],
	owner: Person,
	field: string,
	work: (tx: Parameters<Parameters<typeof repo.transaction>[0]>[0], uploadIds: number[]) => Promise<T>
): Promise<T> {
	const max = BOARD_BOUNDS.photosPerQuestion;
	if (photos.length > max) throw new UserFacingError(field, `Add at most ${max} photos`);
	const staged: StagedUpload[] = [];
	try {
		for (const photo of photos) staged.push(await uploads.stage(photo, field));
		return await repo.transaction(async (tx) => {
			const ids: number[] = [];
			for (const s of staged) ids.push((await uploads.record(tx, s, { ownerId: owner.id, purpose: 'question-photo', field })).id);
			return work(tx, ids);
		});
	} catch (e) {
		await Promise.all(staged.map((s) => s.discard()));
		throw e;
	}
}

const photoRows = (questionId: number, postId: number | null, uploadIds: number[]) =>
	uploadIds.map((uploadId, position) => ({ questionId, postId, uploadId, position }));

async function visible(id: number, viewer: Person | null): Promise<QuestionRow> {
	const q = await repo.findQuestion(id);
	if (!q || !canSee(q, viewer)) throw notFound();
	return q;
}

async function askersOwn(id: number, asker: Person): Promise<QuestionRow> {
	const q = await repo.findQuestion(id);
	if (!q || q.askerId !== asker.id || q.state === 'hidden') throw notFound();
	return q;
}

async function limited(key: string, rule: { limit: number; windowMs: number }) {
	if (!(await consume(key, rule)).allowed) {
		throw new UserFacingError('form', 'You have posted a lot in the last hour: try again later', 429);
	}
}

const rendered = (markdown: string) => ({ body: markdown, bodyHtml: renderMarkdown(markdown), bodyText: markdownToText(markdown) });

export const boardService = {
	/** A new question with up to four photos, all written in one transaction. */
	async ask(input: AskInput, asker: Person, photos: File[] = [], now = new Date()): Promise<QuestionRow> {
		if (input.plantId !== null && !(await repo.ownPlant(input.plantId, asker.id))) {
			throw new UserFacingError('plantId', 'Choose one of your plants', 404);
		}
		await limited(postingKeys.question(asker.id), POSTING_LIMITS.questionsPerAccount);
		return withPhotos(photos, asker, 'photos', async (tx, uploadIds) => {
			const q = (await repo.insertQuestion(
				{
					askerId: asker.id,
					plantId: input.plantId,
					title: input.title,
					isPublic: input.isPublic,
					...rendered(input.body),
					waitingSince: now,
					createdAt: now,
					updatedAt: now
				},
				tx
			))!;
			await repo.insertPhotos(photoRows(q.id, null, uploadIds), tx);
			return q;
		});
	},

	/** A question with its thread, or a 404 for anyone who may not see it. */
	async view(id: number, viewer: Person | null, today: string) {
		const q = await visible(id, viewer);
		const [people, posts, photos, plant] = await Promise.all([
			repo.questionWithPeople(q.id),
			repo.posts(q.id),
			repo.photos(q.id),
			q.plantId && viewer && (isStaff(viewer) || viewer.id === q.askerId) ? repo.plantSummary(q.plantId) : Promise.resolve(undefined)
		]);
		void today;
		const recent = plant ? (await boardService.recentMilestones([plant.plantId])).get(plant.plantId) ?? [] : [];
		return {
			question: q,
			askerName: people!.askerName,
			claimedByName: people!.claimedByName,
			posts: posts.map((p) => ({ ...p, photos: photos.filter((ph) => ph.postId === p.id) })),
			photos: photos.filter((ph) => ph.postId === null),
			plant: plant ? { ...plant, milestones: recent } : null
		};
	},

	async reply(id: number, body: string, asker: Person, now = new Date()) {
		const q = await askersOwn(id, asker);
		await limited(postingKeys.reply(asker.id), POSTING_LIMITS.repliesPerAccount);
		await repo.transaction(async (tx) => {
			await repo.insertPost({ questionId: q.id, authorId: asker.id, kind: 'reply', ...rendered(body), createdAt: now }, tx);
			// A reply after an answer puts the question back in the queue, at the back.
			if (q.state !== 'waiting') await repo.updateQuestion(q.id, { state: 'waiting', waitingSince: now }, now, tx);
		});
	},

	async resolve(id: number, asker: Person, now = new Date()) {
		const q = await askersOwn(id, asker);
		await repo.updateQuestion(q.id, { state: 'resolved' }, now);
	},

	async accept(id: number, postId: number, asker: Person, now = new Date()) {
		const q = await askersOwn(id, asker);
		await repo.transaction(async (tx) => {
			const post = await repo.findPost(q.id, postId, tx);
			if (!post || post.kind !== 'answer') throw new UserFacingError('postId', 'Choose one of the answers to this question', 404);
			await repo.clearAccepted(q.id, tx);
			await repo.markAccepted(post.id, tx);
			await repo.updateQuestion(q.id, { state: 'resolved' }, now, tx);
		});
	},

	/** Deletes the question, its posts and its photos (rows in one transaction, files once it commits). */
	async remove(id: number, asker: Person) {
		const q = await askersOwn(id, asker);
		const removeFiles = await repo.transaction(async (tx) => {
			const removals = [];
			for (const uploadId of await repo.photoUploadIds(q.id, tx)) removals.push(await uploads.remove(tx, uploadId));
			await repo.deleteQuestion(q.id, tx);
			return removals;
		});
		await Promise.all(removeFiles.map((r) => r()));
	},

	/** Who may see a question's photo: whoever may see the question. */
	async canSeePhoto(viewer: Person | null, uploadId: number): Promise<boolean> {
		const q = await repo.questionOfPhoto(uploadId);
		return q !== undefined && canSee(q, viewer);
	},

	// Staff side.
	async claim(id: number, staff: Person, now = new Date()) {
		if (!isStaff(staff)) throw notFound();
		const q = await repo.questionWithPeople(id);
		if (!q) throw notFound();
		if (!(await repo.claim(id, staff.id, now))) {
			throw new UserFacingError('form', `${q.claimedByName ?? 'Someone else'} is already answering this question`, 409);
		}
	},

	async release(id: number, staff: Person, now = new Date()) {
		const q = await repo.findQuestion(id);
		if (!q || !isStaff(staff)) throw notFound();
		if (q.claimedById === staff.id || staff.role === 'owner') await repo.updateQuestion(id, { claimedById: null, claimedAt: null }, now);
	},

	/**
	 * Saves the answer (with up to four photos), then queues the e-mail to the asker. The worker
	 * sends it and retries; a queue that cannot be reached is logged and does not lose the answer.
	 */
	async answer(id: number, body: string, staff: Person, notify: AnswerNotifier = queueAnswerMail, photos: File[] = [], now = new Date()) {
		if (!isStaff(staff)) throw notFound();
		const q = await withPhotos(photos, staff, 'photos', async (tx, uploadIds) => {
			const q = await repo.lockQuestion(id, tx);
			if (!q) throw notFound();
			if (q.claimedById && q.claimedById !== staff.id) {
				throw new UserFacingError('form', 'Another member of staff has claimed this question: ask them, or release it first', 409);
			}
			const post = (await repo.insertPost({ questionId: q.id, authorId: staff.id, kind: 'answer', ...rendered(body), createdAt: now }, tx))!;
			await repo.insertPhotos(photoRows(q.id, post.id, uploadIds), tx);
			const state: QuestionState = q.state === 'hidden' ? 'hidden' : 'answered';
			await repo.updateQuestion(q.id, { state, answeredAt: now, claimedById: null, claimedAt: null }, now, tx);
			return q;
		});
		try {
			await notify({ questionId: q.id });
			return { mailed: true };
		} catch (e) {
			console.error('answer mail could not be queued', e);
			return { mailed: false };
		}
	},

	async setState(id: number, state: QuestionState, staff: Person, now = new Date()) {
		if (!isStaff(staff)) throw notFound();
		const q = await repo.findQuestion(id);
		if (!q) throw notFound();
		await repo.updateQuestion(id, state === 'waiting' && q.state !== 'waiting' ? { state, waitingSince: now } : { state }, now);
	},

	/** The owner's one step from a good answer to a draft guide: the question's title, the answer's text. */
	async toGuide(id: number, postId: number, owner: Person) {
		if (owner.role !== 'owner') throw new UserFacingError('form', 'Only the owner turns answers into guides', 403);
		const q = await repo.findQuestion(id);
		if (!q) throw notFound();
		const post = await repo.findPost(q.id, postId);
		if (!post || post.kind !== 'answer') throw new UserFacingError('postId', 'Choose one of the answers to this question', 404);
		return guideService.create(
			{ title: q.title, summary: summaryFrom(q.bodyText), body: post.body, slug: '', stages: [], groups: [], replaces: '' },
			owner,
			q.id
		);
	},

	queue: (states: QuestionState[], limit: number, offset: number) => repo.queue(states, limit, offset),

	/** Up to `perPlant` latest milestones of each plant, for showing beside its questions. */
	async recentMilestones(plantIds: number[], perPlant = 3) {
		const byPlant = new Map<number, { kind: string; on: string; generation: number; photoId: number | null }[]>();
		for (const m of await repo.recentMilestones(plantIds)) {
			const list = byPlant.get(m.plantId) ?? [];
			if (list.length < perPlant) list.push({ kind: m.kind, on: m.on, generation: m.generation, photoId: m.photoId });
			byPlant.set(m.plantId, list);
		}
		return byPlant;
	},
	countQueue: (states: QuestionState[]) => repo.countQueue(states),
	listPublic: (limit: number, offset: number) => repo.listPublic(limit, offset),
	countPublic: () => repo.countPublic(),
	listMine: (asker: Person) => repo.listByAsker(asker.id),
	plantsOf: (gardener: Person) => repo.plantsOf(gardener.id)
};
