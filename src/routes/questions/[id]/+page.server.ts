import { error, redirect } from '@sveltejs/kit';
import { plantAgeWeeks, publicAskerName } from '$lib/board/questions';
import { isPlantStage, stageLabel } from '$lib/care/stages';
import { acceptSchema, postSchema } from '$lib/schema/questions';
import { requireUser } from '$lib/server/auth';
import { boardService } from '$lib/server/board/service';
import { UserFacingError } from '$lib/server/errors';
import { runForm } from '$lib/server/forms';
import { rowIdOr404 } from '$lib/server/params';
import { z } from 'zod';
import type { Actions, PageServerLoad } from './$types';

const nothing = z.object({});

const questionId = (raw: string) => rowIdOr404(raw, 'No such question');

// Public: a public answered question is for everyone; anything else answers 404 unless the viewer
// is its asker or staff (the service decides, so private questions are never revealed).
export const load: PageServerLoad = async (event) => {
	const viewer = event.locals.user ?? null;
	const today = new Date().toISOString().slice(0, 10);
	try {
		const v = await boardService.view(questionId(event.params.id), viewer, today);
		const isAsker = viewer?.id === v.question.askerId;
		const isStaff = viewer?.role === 'owner' || viewer?.role === 'staff';
		return {
			question: { id: v.question.id, title: v.question.title, bodyHtml: v.question.bodyHtml, state: v.question.state, isPublic: v.question.isPublic, createdAt: v.question.createdAt },
			// The asker and staff see the full name; everyone else the first name only.
			askedBy: isAsker ? 'you' : isStaff ? v.askerName : publicAskerName(v.askerName),
			posts: v.posts.map(({ id, kind, bodyHtml, accepted, createdAt, authorName, photos }) => ({ id, kind, bodyHtml, accepted, createdAt, authorName, photos })),
			photos: v.photos,
			plant: v.plant && (isAsker || isStaff) ? { cultivarName: v.plant.cultivarName, ageWeeks: plantAgeWeeks(v.plant.plantedOn, v.plant.ageAtPlantingWeeks, today), stage: v.plant.stage && isPlantStage(v.plant.stage) ? stageLabel(v.plant.stage) : null } : null,
			isAsker,
			isStaff,
			asked: event.url.searchParams.has('asked')
		};
	} catch (e) {
		if (e instanceof UserFacingError && e.status === 404) error(404, 'No such question');
		throw e;
	}
};

export const actions: Actions = {
	reply: async (event) => {
		const me = requireUser(event);
		const { failure } = await runForm(event.request, postSchema, (d) => boardService.reply(questionId(event.params.id), d.body, me));
		return failure ?? { replied: true };
	},
	resolve: async (event) => {
		const me = requireUser(event);
		const { failure } = await runForm(event.request, nothing, () => boardService.resolve(questionId(event.params.id), me));
		return failure ?? { resolved: true };
	},
	accept: async (event) => {
		const me = requireUser(event);
		const { failure } = await runForm(event.request, acceptSchema, (d) => boardService.accept(questionId(event.params.id), d.postId, me));
		return failure ?? { accepted: true };
	},
	remove: async (event) => {
		const me = requireUser(event);
		const { failure } = await runForm(event.request, nothing, () => boardService.remove(questionId(event.params.id), me));
		if (failure) return failure;
		redirect(303, '/ask?deleted=1');
	}
};
