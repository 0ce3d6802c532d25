import { and, asc, count, desc, eq, inArray, isNull, ne, or, sql } from 'drizzle-orm';
import type { QuestionState } from '../../board/vocabulary';
import { db } from '../db';
import { plantsRepository } from '../plants/repository';
import { cultivars, milestones, plants, questionPhotos, questionPosts, questions, uploads, users } from '../db/schema';

export type QuestionRow = typeof questions.$inferSelect;
export type PostRow = typeof questionPosts.$inferSelect;
type Tx = Parameters<Parameters<typeof db.transaction>[0]>[0];
type Conn = typeof db | Tx;

/** Who claimed a question, by name. */
const claimedByName = sql<string | null>`(select u.name from users u where u.id = ${questions.claimedById})`;
const PUBLIC_STATES: QuestionState[] = ['answered', 'resolved'];

/** What a question's page shows about its plant: never its location or owner. */
const plantColumns = {
	plantId: plants.id,
	cultivarName: cultivars.name,
	cultivarGroup: cultivars.group,
	plantedOn: plants.plantedOn,
	ageAtPlantingWeeks: plants.ageAtPlantingWeeks,
	stage: plants.stage,
	nextStepKind: plants.nextStepKind,
	nextStepOn: plants.nextStepOn,
	lastMilestoneKind: plants.lastMilestoneKind,
	lastMilestoneOn: plants.lastMilestoneOn
};

export const boardRepository = {
	transaction: <T>(fn: (tx: Tx) => Promise<T>) => db.transaction(fn),

	insertQuestion: async (values: typeof questions.$inferInsert, c: Conn = db) => (await c.insert(questions).values(values).returning())[0],

	findQuestion: async (id: number, c: Conn = db) => (await c.select().from(questions).where(eq(questions.id, id)))[0],

	lockQuestion: async (id: number, c: Conn) => (await c.select().from(questions).where(eq(questions.id, id)).for('update'))[0],

	updateQuestion: (id: number, values: Partial<typeof questions.$inferInsert>, now: Date, c: Conn = db) =>
		c.update(questions).set({ ...values, updatedAt: now }).where(eq(questions.id, id)),

	/** Claims only when nobody else holds it, so two staff clicking at once cannot both get it. */
	claim: async (id: number, staffId: number, now: Date) =>
		(
			await db
				.update(questions)
				.set({ claimedById: staffId, claimedAt: now })
				.where(and(eq(questions.id, id), or(isNull(questions.claimedById), eq(questions.claimedById, staffId))))
				.returning({ id: questions.id })
		)[0],

	deleteQuestion: (id: number, c: Conn = db) => c.delete(questions).where(eq(questions.id, id)),

	insertPost: async (values: typeof questionPosts.$inferInsert, c: Conn = db) => (await c.insert(questionPosts).values(values).returning())[0],

	findPost: async (questionId: number, postId: number, c: Conn = db) =>
		(await c.select().from(questionPosts).where(and(eq(questionPosts.questionId, questionId), eq(questionPosts.id, postId))))[0],

	clearAccepted: (questionId: number, c: Conn) => c.update(questionPosts).set({ accepted: false }).where(eq(questionPosts.questionId, questionId)),
	markAccepted: (postId: number, c: Conn) => c.update(questionPosts).set({ accepted: true }).where(eq(questionPosts.id, postId)),

	posts: (questionId: number) =>
		db
			.select({ id: questionPosts.id, kind: questionPosts.kind, bodyHtml: questionPosts.bodyHtml, body: questionPosts.body, accepted: questionPosts.accepted, createdAt: questionPosts.createdAt, authorName: users.name, authorRole: users.role })
			.from(questionPosts)
			.leftJoin(users, eq(users.id, questionPosts.authorId))
			.where(eq(questionPosts.questionId, questionId))
			.orderBy(asc(questionPosts.createdAt), asc(questionPosts.id)),

	/** The question with its asker's name and e-mail and who claimed it. */
	questionWithPeople: async (id: number) =>
		(
			await db
				.select({ question: questions, askerName: users.name, askerEmail: users.email, claimedByName })
				.from(questions)
				.innerJoin(users, eq(users.id, questions.askerId))
				.where(eq(questions.id, id))
		)[0],

	plantSummary: async (plantId: number) =>
		(await db.select(plantColumns).from(plants).innerJoin(cultivars, eq(cultivars.id, plants.cultivarId)).where(eq(plants.id, plantId)))[0],

	/** The latest milestones of some plants, newest first (the caller keeps a few per plant). */
	recentMilestones: (plantIds: number[]) => plantsRepository(db).milestonesOf(plantIds),

	/** The asker's own plant, or nothing when the plant is someone else's. */
	ownPlant: async (plantId: number, gardenerId: number) =>
		(await db.select({ id: plants.id }).from(plants).where(and(eq(plants.id, plantId), eq(plants.gardenerId, gardenerId))))[0],

	plantsOf: (gardenerId: number) =>
		db
			.select({ id: plants.id, cultivarName: cultivars.name, plantedOn: plants.plantedOn })
			.from(plants)
			.innerJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(and(eq(plants.gardenerId, gardenerId), isNull(plants.archivedAt)))
			.orderBy(asc(plants.id)),

	listByAsker: (askerId: number) =>
		db
			.select({ id: questions.id, title: questions.title, state: questions.state, isPublic: questions.isPublic, createdAt: questions.createdAt })
			.from(questions)
			.where(and(eq(questions.askerId, askerId), ne(questions.state, 'hidden')))
			.orderBy(desc(questions.createdAt)),

	/** The staff queue: longest waiting first, with the plant beside each question. */
	queue: (states: QuestionState[], limit: number, offset: number) =>
		db
			.select({
				id: questions.id,
				title: questions.title,
				state: questions.state,
				waitingSince: questions.waitingSince,
				isPublic: questions.isPublic,
				askerName: users.name,
				claimedByName,
				claimedById: questions.claimedById,
				...plantColumns
			})
			.from(questions)
			.innerJoin(users, eq(users.id, questions.askerId))
			.leftJoin(plants, eq(plants.id, questions.plantId))
			.leftJoin(cultivars, eq(cultivars.id, plants.cultivarId))
			.where(inArray(questions.state, states))
			.orderBy(asc(questions.waitingSince), asc(questions.id))
			.limit(limit)
			.offset(offset),

	countQueue: async (states: QuestionState[]) => (await db.select({ n: count() }).from(questions).where(inArray(questions.state, states)))[0]?.n ?? 0,

	/** Answered public questions, newest answer first. */
	listPublic: (limit: number, offset: number) =>
		db
			.select({ id: questions.id, title: questions.title, state: questions.state, answeredAt: questions.answeredAt, askerName: users.name, bodyText: questions.bodyText })
			.from(questions)
			.innerJoin(users, eq(users.id, questions.askerId))
			.where(and(eq(questions.isPublic, true), inArray(questions.state, PUBLIC_STATES)))
			.orderBy(desc(questions.answeredAt), desc(questions.id))
			.limit(limit)
			.offset(offset),

	insertPhotos: (values: (typeof questionPhotos.$inferInsert)[], c: Conn) => (values.length ? c.insert(questionPhotos).values(values) : Promise.resolve()),

	/** A question's photos and its answers' photos, in order, with their sizes for the page. */
	photos: (questionId: number) =>
		db
			.select({ uploadId: questionPhotos.uploadId, postId: questionPhotos.postId, width: uploads.width, height: uploads.height })
			.from(questionPhotos)
			.innerJoin(uploads, eq(uploads.id, questionPhotos.uploadId))
			.where(eq(questionPhotos.questionId, questionId))
			.orderBy(asc(questionPhotos.postId), asc(questionPhotos.position)),

	photoUploadIds: async (questionId: number, c: Conn) =>
		(await c.select({ id: questionPhotos.uploadId }).from(questionPhotos).where(eq(questionPhotos.questionId, questionId))).map((r) => r.id),

	/** The question a photo belongs to, for deciding who may see the photo. */
	questionOfPhoto: async (uploadId: number) =>
		(await db.select({ question: questions }).from(questionPhotos).innerJoin(questions, eq(questions.id, questionPhotos.questionId)).where(eq(questionPhotos.uploadId, uploadId)))[0]
			?.question,

	countPublic: async () =>
		(await db.select({ n: count() }).from(questions).where(and(eq(questions.isPublic, true), inArray(questions.state, PUBLIC_STATES))))[0]?.n ?? 0
};
