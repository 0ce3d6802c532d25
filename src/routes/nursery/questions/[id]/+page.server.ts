import { error, redirect } from '@sveltejs/kit';
import { plantAgeWeeks, waitedFor } from '$lib/board/questions';
import { QUESTION_STATES } from '$lib/board/vocabulary';
import { postSchema, stateSchema, toGuideSchema } from '$lib/schema/questions';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { boardService } from '$lib/server/board/service';
import { filesOf, runForm, runFormData } from '$lib/server/forms';
import { rowIdOr404 } from '$lib/server/params';
import { z } from 'zod';
import type { Actions, PageServerLoad } from './$types';

const nothing = z.object({});

const questionId = (raw: string) => rowIdOr404(raw, 'No such question');

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, ...STAFF_ROLES);
	const now = new Date();
	const today = now.toISOString().slice(0, 10);
	const v = await boardService.view(questionId(event.params.id), me, today).catch(() => error(404, 'No such question'));
	return {
		question: {
			id: v.question.id,
			title: v.question.title,
			bodyHtml: v.question.bodyHtml,
			state: v.question.state,
			isPublic: v.question.isPublic,
			createdAt: v.question.createdAt,
			waited: waitedFor(v.question.waitingSince, now),
			claimedById: v.question.claimedById
		},
		askerName: v.askerName,
		claimedByName: v.claimedByName,
		posts: v.posts.map(({ id, kind, bodyHtml, accepted, createdAt, authorName, photos }) => ({ id, kind, bodyHtml, accepted, createdAt, authorName, photos })),
		photos: v.photos,
		plant: v.plant ? { ...v.plant, ageWeeks: plantAgeWeeks(v.plant.plantedOn, v.plant.ageAtPlantingWeeks, today) } : null,
		meId: me.id,
		isOwner: me.role === 'owner',
		states: QUESTION_STATES
	};
};

export const actions: Actions = {
	claim: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure } = await runForm(event.request, nothing, () => boardService.claim(questionId(event.params.id), me));
		return failure ?? { claimed: true };
	},
	release: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure } = await runForm(event.request, nothing, () => boardService.release(questionId(event.params.id), me));
		return failure ?? { released: true };
	},
	answer: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const form = await event.request.formData().catch(() => new FormData());
		const { failure, result } = await runFormData(form, postSchema, (d) => boardService.answer(questionId(event.params.id), d.body, me, undefined, filesOf(form, 'photos')));
		return failure ?? { answered: true, mailed: result.mailed };
	},
	state: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, stateSchema, async (d) => (await boardService.setState(questionId(event.params.id), d.state, me), d.state));
		return failure ?? { stateSet: result };
	},
	guide: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure, result } = await runForm(event.request, toGuideSchema, (d) => boardService.toGuide(questionId(event.params.id), d.postId, me));
		if (failure) return failure;
		redirect(303, `/nursery/guides/${result.id}?saved=1`);
	}
};
