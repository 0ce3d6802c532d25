import { error } from '@sveltejs/kit';
import { UPLOAD_VARIANTS, type UploadVariant } from '$lib/uploads';
import { uploads } from '$lib/server/uploads';
import { canSee } from '$lib/server/uploads/access';
import type { RequestHandler } from './$types';

/** A stored photo, only to those who may see what it belongs to; private, cached long (its bytes never change). */
// Public: a public answer's photos and a published guide's images are for visitors too; `canSee`
// asks what the upload belongs to and refuses the signed-out for everything else (404).
export const GET: RequestHandler = async (event) => {
	const user = event.locals.user ?? null;
	const id = Number(event.params.id);
	const variant = event.params.variant as UploadVariant;
	if (!Number.isSafeInteger(id) || id < 1 || !UPLOAD_VARIANTS.includes(variant)) error(404, 'No such photo');
	const upload = await uploads.byId(id);
	if (!upload || !(await canSee(user, upload))) error(404, 'No such photo');
	const bytes = await uploads.read(upload, variant);
	if (!bytes) error(404, 'No such photo');
	return new Response(new Uint8Array(bytes), {
		headers: {
			'Content-Type': upload.contentType,
			'Content-Length': String(bytes.length),
			'Content-Disposition': 'inline',
			'X-Content-Type-Options': 'nosniff',
			'Cache-Control': 'private, max-age=31536000, immutable'
		}
	});
};
