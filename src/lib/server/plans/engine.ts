/**
 * Which engine wrote a stored plan. The fingerprint is a hash of the plans the engine makes for a
 * fixed set of inputs (every built-in cultivar in every built-in climate, with a logged flower):
 * any change to the model, its constants or its wording changes it, and nobody has to remember to
 * bump a number. Regeneration stamps it on the plant row; the worker regenerates, a batch at a
 * time, every planted plant whose plan another engine wrote, so a recalibration reaches the plans
 * gardeners already have (their pages say the care model was updated, reminders move with it).
 */
import { createHash } from 'node:crypto';
import { climates, computePlan, cultivars } from '$lib/care';

let fingerprint: string | undefined;

export function engineFingerprint(): string {
	fingerprint ??= createHash('sha256')
		.update(
			JSON.stringify(
				cultivars.flatMap((cultivar) =>
					climates.map((climate) => computePlan({ cultivar, climate, plantedOn: '2026-03-01', ageAtPlantingWeeks: 12, observed: { shotOn: '2027-02-15' } }))
				)
			)
		)
		.digest('hex')
		.slice(0, 16);
	return fingerprint;
}
