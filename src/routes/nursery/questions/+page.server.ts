import { plantAgeWeeks, waitedFor } from '$lib/board/questions';
import { QUESTION_STATES } from '$lib/board/vocabulary';
import { pageQuery } from '$lib/schema/paging';
import { queueFilterSchema } from '$lib/schema/questions';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { boardService } from '$lib/server/board/service';
import type { PageServerLoad } from './$types';

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, ...STAFF_ROLES);
	const { state } = queueFilterSchema.parse({ state: event.url.searchParams.get('state') ?? undefined });
	const states = state === 'all' ? [...QUESTION_STATES] : [state];
	const { size, ...asked } = pageQuery(event.url);
	const total = await boardService.countQueue(states);
	const page = Math.min(asked.page, Math.max(1, Math.ceil(total / size)));
	const now = new Date();
	const today = now.toISOString().slice(0, 10);
	const rows = await boardService.queue(states, size, (page - 1) * size);
	const milestones = await boardService.recentMilestones(rows.flatMap((q) => (q.plantId ? [q.plantId] : [])));
	return {
		state,
		total,
		page,
		size,
		meId: me.id,
		questions: rows.map((q) => ({
			id: q.id,
			title: q.title,
			state: q.state,
			waited: waitedFor(q.waitingSince, now),
			askerName: q.askerName,
			claimedByName: q.claimedByName,
			claimedByMe: q.claimedById === me.id,
			plant: q.plantId
				? {
						cultivarName: q.cultivarName,
						cultivarGroup: q.cultivarGroup,
						ageWeeks: plantAgeWeeks(q.plantedOn, q.ageAtPlantingWeeks, today),
						stage: q.stage,
						nextStepKind: q.nextStepKind,
						nextStepOn: q.nextStepOn,
						lastMilestoneKind: q.lastMilestoneKind,
						lastMilestoneOn: q.lastMilestoneOn,
						milestones: milestones.get(q.plantId) ?? []
					}
				: null
		}))
	};
};
