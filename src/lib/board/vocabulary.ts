/**
 * The words and limits of the owner's guides and the question board, exported once: the zod
 * schemas, the pg enums and the pages derive from these.
 */
import type { CultivarGroup } from '../care/types';
import { PLANT_STAGE_IDS, type PlantStage } from '../care/stages';

/** Guides are filed under the plant's stages, the same words the plans and the chart use. */
export const GUIDE_STAGES = PLANT_STAGE_IDS as [PlantStage, ...PlantStage[]];

export const GUIDE_STATUSES = ['draft', 'published'] as const;
export type GuideStatus = (typeof GUIDE_STATUSES)[number];

/** Waiting for staff, answered by staff, resolved by the asker, hidden by staff (spam, abuse). */
export const QUESTION_STATES = ['waiting', 'answered', 'resolved', 'hidden'] as const;
export type QuestionState = (typeof QUESTION_STATES)[number];

export const QUESTION_STATE_LABELS: Record<QuestionState, string> = {
	waiting: 'Waiting for an answer',
	answered: 'Answered',
	resolved: 'Resolved',
	hidden: 'Hidden'
};

/** Who wrote a post under a question: staff answer, the asker replies. */
export const POST_KINDS = ['answer', 'reply'] as const;
export type PostKind = (typeof POST_KINDS)[number];

/** Genome groups of the cultivar catalogue (care/types.ts CultivarGroup), for tagging guides. */
export const CULTIVAR_GROUPS = ['AA', 'AAA', 'AAB', 'ABB', 'AAAA', 'AAAB', 'AABB', 'BB', 'other'] as const satisfies readonly CultivarGroup[];
// Fails to compile when the catalogue gains a group this list lacks.
const everyGroupListed: Record<CultivarGroup, true> = Object.fromEntries(CULTIVAR_GROUPS.map((g) => [g, true])) as Record<
	(typeof CULTIVAR_GROUPS)[number],
	true
>;
void everyGroupListed;

export const BOARD_BOUNDS = {
	title: { min: 3, max: 140 },
	summary: { min: 1, max: 240 },
	/** Long enough for a thorough guide, short enough to keep a page and its revisions sane. */
	guideBody: { min: 1, max: 50_000 },
	questionBody: { min: 10, max: 5_000 },
	postBody: { min: 1, max: 10_000 },
	slug: { min: 2, max: 80 },
	searchQuery: { min: 2, max: 200 },
	imageAlt: { max: 140 },
	photosPerQuestion: 4
} as const;

/** Posting limits per account (counted in PostgreSQL like the sign-in limits). */
export const POSTING_LIMITS = {
	questionsPerAccount: { limit: 10, windowMs: 60 * 60 * 1000 },
	repliesPerAccount: { limit: 30, windowMs: 60 * 60 * 1000 }
} as const;
