/**
 * Who may see an upload, by purpose: each purpose asks the thing the file belongs to. A purpose
 * without a rule is seen by nobody. The route answers 404 to anyone refused, so ids reveal nothing.
 */
import type { UploadPurpose } from '$lib/uploads';
import type { AuthUser } from '../auth/guard';
import { plantService } from '../plants/plant-service';
import type { UploadRow } from './repository';

type Viewer = Pick<AuthUser, 'id' | 'role'>;

const rules: Record<UploadPurpose, (viewer: Viewer, upload: UploadRow) => Promise<boolean>> = {
	'milestone-photo': (viewer, upload) => plantService.canSeePhoto(viewer, upload.id)
};

export async function canSee(viewer: Viewer, upload: UploadRow): Promise<boolean> {
	const rule = rules[upload.purpose];
	return rule ? rule(viewer, upload) : false;
}
