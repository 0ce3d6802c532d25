import { error } from '@sveltejs/kit';
import { CULTIVAR_GROUPS } from '$lib/board/vocabulary';
import { GUIDE_STAGES } from '$lib/guides';
import { guideImageSchema, guideSchema, revisionSchema } from '$lib/schema/guides';
import { requireUser, STAFF_ROLES } from '$lib/server/auth';
import { filesOf, runForm, runFormData } from '$lib/server/forms';
import { rowIdOr404 } from '$lib/server/params';
import { guideService } from '$lib/server/guides/service';
import { z } from 'zod';
import type { Actions, PageServerLoad } from './$types';

const nothing = z.object({});
const guideId = (raw: string) => rowIdOr404(raw, 'No such guide');

export const load: PageServerLoad = async (event) => {
	const me = requireUser(event, ...STAFF_ROLES);
	const guide = await guideService.get(guideId(event.params.id));
	if (!guide) error(404, 'No such guide');
	return {
		guide,
		revisions: await guideService.revisions(guide.id),
		isOwner: me.role === 'owner',
		canEdit: me.role === 'owner' || guide.status === 'draft',
		stages: GUIDE_STAGES,
		groups: CULTIVAR_GROUPS,
		replaceable: guideService.replaceable(),
		saved: event.url.searchParams.has('saved')
	};
};


export const actions: Actions = {
	save: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure } = await runForm(event.request, guideSchema, (d) => guideService.save(guideId(event.params.id), d, me));
		return failure ?? { saved: true };
	},
	publish: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure } = await runForm(event.request, nothing, () => guideService.publish(guideId(event.params.id), me));
		return failure ?? { published: true };
	},
	unpublish: async (event) => {
		const me = requireUser(event, 'owner');
		const { failure } = await runForm(event.request, nothing, () => guideService.unpublish(guideId(event.params.id), me));
		return failure ?? { unpublished: true };
	},
	/** Stores an image for the text and hands back the Markdown that shows it (the page adds it to the text). */
	image: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const id = guideId(event.params.id);
		const form = await event.request.formData().catch(() => new FormData());
		const { failure, result } = await runFormData(form, guideImageSchema, (d) => guideService.addImage(id, filesOf(form, 'image')[0], d.alt, me));
		return failure ?? { imageMarkdown: result.markdown };
	},
	restore: async (event) => {
		const me = requireUser(event, ...STAFF_ROLES);
		const { failure, result } = await runForm(event.request, revisionSchema, async (d) => (await guideService.restore(guideId(event.params.id), d.revision, me), d.revision));
		return failure ?? { restored: result };
	}
};
