/**
 * Who may see an upload, by purpose: each purpose asks the thing the file belongs to. A purpose
 * without a rule is seen by nobody. The route answers 404 to anyone refused, so ids reveal nothing.
 * `viewer` is null for someone signed out: only a public answer's photos and a published guide's
 * images are theirs to see.
 */
import type { UploadPurpose } from '$lib/uploads';
import type { AuthUser } from '../auth/guard';
import { boardService } from '../board/service';
import { guideService } from '../guides/service';
import { plantService } from '../plants/plant-service';
import type { UploadRow } from './repository';

type Viewer = Pick<AuthUser, 'id' | 'role'>;

const rules: Record<UploadPurpose, (viewer: Viewer | null, upload: UploadRow) => Promise<boolean>> = {
	'milestone-photo': async (viewer, upload) => viewer !== null && plantService.canSeePhoto(viewer, upload.id),
	'question-photo': (viewer, upload) => boardService.canSeePhoto(viewer, upload.id),
	'guide-image': (viewer, upload) => guideService.canSeeImage(viewer, upload.id)
};

export async function canSee(viewer: Viewer | null, upload: UploadRow): Promise<boolean> {
	const rule = rules[upload.purpose];
	return rule ? rule(viewer, upload) : false;
}
