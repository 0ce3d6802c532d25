/**
 * The rules of a gardener's plant: who may see and change it, the milestone log with its date
 * rules, divisions, and the plant's settings. Every change re-times the stored plan through
 * `regeneratePlan` inside the same transaction, so a refused change writes nothing.
 */
import { isPlantStage, parseIsoDate, type Units } from '$lib/care';
import { plantAccess } from '$lib/plants/access';
import { bunchMassGrams, MILESTONE_BOUNDS, type LossReason, type MilestoneKind } from '$lib/plants/milestones';
import type { ChangeCause } from '$lib/plants/changes';
import type { MilestoneInput, MilestonePatch, PlantPatch } from '$lib/schema/plant';
import { AGE_MAX_WEEKS } from '$lib/schema/plan';
import { formatDay, generationLabel, stageLabel } from '$lib/plan-text';
import { stageGuideHref } from '$lib/stage-guides';
import { agendaFor } from '$lib/plants/agenda';
import { stepFromStored } from '$lib/plants/plan-diff';
import { describeCause, describeShift } from '$lib/plants/changes';
import { LOSS_REASON_LABELS, MILESTONE_LABELS, bunchMassText, currentGeneration } from '$lib/plants/milestones';
import { photoUrls } from './json';
import { plansRepository } from '../plans/repository';
import type { AuthUser } from '../auth/guard';
import { catalogueService } from '../catalogue/service';
import { nurseryService } from '../nursery/service';
import { todayIso } from '../plan-preview';
import { UserFacingError } from '../errors';
import type { Tx } from '../db/tx';
import { regeneratePlan, type Regeneration } from '../plans/regenerate';
import { uploads, type StagedUpload, type UploadService } from '../uploads';
import { plantRepository, type MilestoneRow, type PlantRow, type PlantRepository } from './plant-repository';

export interface PlantServiceDeps {
	repo: PlantRepository;
	regenerate: (tx: Tx, plantId: number, cause: ChangeCause) => Promise<Regeneration | null>;
	uploads: UploadService;
	climateBySlug: (slug: string) => Promise<{ id: number } | undefined>;
	/** Today in the nursery's time zone. */
	today: () => Promise<string>;
}

type Viewer = Pick<AuthUser, 'id' | 'role'>;

const NOT_FOUND = () => new UserFacingError('id', 'No such plant', 404);
const READ_ONLY = () => new UserFacingError('plant', 'Nursery staff see plants read-only: only the gardener can change a plant', 403);

/** What a milestone of this kind keeps; values of other kinds are dropped. */
function kindValues(kind: MilestoneKind, m: { leaves?: number; hands?: number; bunchMass?: number; reason?: LossReason }, units: Units) {
	const grams = m.bunchMass === undefined ? undefined : bunchMassGrams(m.bunchMass, units);
	if (grams !== undefined && grams > MILESTONE_BOUNDS.bunchMassKg.max * 1000) {
		throw new UserFacingError('bunchMass', `That is heavier than any bunch (over ${MILESTONE_BOUNDS.bunchMassKg.max} kg): check the weight`);
	}
	return {
		leaves: kind === 'leaves' ? (m.leaves ?? null) : null,
		hands: kind === 'harvest' ? (m.hands ?? null) : null,
		bunchMassG: kind === 'harvest' ? (grams ?? null) : null,
		lossReason: kind === 'lost' ? (m.reason ?? null) : null
	};
}

/** The date rules of the log: not before planting, not after today, a harvest not before its stem's flower. */
function checkDay(plant: PlantRow, on: string, today: string, kind: MilestoneKind, generation: number, others: MilestoneRow[]) {
	if (!plant.plantedOn) throw new UserFacingError('on', 'Set the planting date before logging what happened');
	if (on < plant.plantedOn) throw new UserFacingError('on', `Give a day on or after planting (${formatDay(plant.plantedOn)})`);
	if (on > today) throw new UserFacingError('on', `Give a day no later than today (${formatDay(today)})`);
	const sameStem = others.filter((o) => o.generation === generation);
	const shot = sameStem.filter((o) => o.kind === 'shooting').map((o) => o.on).sort().at(-1);
	const harvested = sameStem.filter((o) => o.kind === 'harvest').map((o) => o.on).sort()[0];
	if (kind === 'harvest' && shot && on < shot) throw new UserFacingError('on', `The flower on this stem was logged on ${formatDay(shot)}: the harvest comes after it`);
	if (kind === 'shooting' && harvested && on > harvested) throw new UserFacingError('on', `This stem's harvest was logged on ${formatDay(harvested)}: the flower comes before it`);
}

/** Weeks from the follower's emergence (logged or forecast) to its division, within the age a plan accepts. */
function ageAtDivisionWeeks(followersOn: string | undefined, on: string): number {
	if (!followersOn) return 0;
	const weeks = Math.round((parseIsoDate(on) - parseIsoDate(followersOn)) / 7);
	return Math.min(AGE_MAX_WEEKS, Math.max(0, weeks));
}

export function createPlantService(deps: PlantServiceDeps) {
	const { repo } = deps;

	/** The plant if the viewer may see it; another gardener's plant does not exist for them. */
	async function visible(viewer: Viewer, plantId: number) {
		const found = await repo.plant(plantId);
		if (!found) throw NOT_FOUND();
		const access = plantAccess(viewer, found.plant);
		if (access === 'none') throw NOT_FOUND();
		return { ...found, access };
	}

	async function editable(viewer: Viewer, plantId: number) {
		const found = await visible(viewer, plantId);
		if (found.access !== 'edit') throw READ_ONLY();
		return found;
	}

	async function milestoneOf(viewer: Viewer, plantId: number, milestoneId: number, edit: boolean) {
		const found = edit ? await editable(viewer, plantId) : await visible(viewer, plantId);
		const milestone = await repo.milestone(plantId, milestoneId);
		if (!milestone) throw new UserFacingError('milestoneId', 'No such milestone', 404);
		return { ...found, milestone };
	}

	/** Runs a write and its regeneration in one transaction; staged photos are removed if it fails. */
	async function inTransaction<T>(staged: StagedUpload | undefined, work: (tx: Tx) => Promise<T>): Promise<T> {
		try {
			return await repo.transaction(work);
		} catch (e) {
			await staged?.discard();
			throw e;
		}
	}

	return {
		visible,

		/** The plant as its API shows it: the row, its milestones and its stored steps with their uids. */
		async detail(viewer: Viewer, plantId: number) {
			const found = await visible(viewer, plantId);
			const [milestones, steps] = await Promise.all([repo.milestones(plantId), repo.steps(plantId)]);
			return { ...found, milestones, steps };
		},

		/** Everything the plant page shows, from the stored plan (nothing is recomputed here). */
		async page(viewer: Viewer, plantId: number) {
			const found = await visible(viewer, plantId);
			const { plant } = found;
			const units = plant.units ?? 'metric';
			const [rows, milestones, changes, family, today] = await Promise.all([
				repo.steps(plantId),
				repo.milestones(plantId),
				plansRepository.lastChanges(repo.connection, plantId),
				repo.family(plant.id, plant.parentPlantId),
				deps.today()
			]);
			const steps = rows.map(stepFromStored);
			const titleOf = new Map(rows.map((r) => [r.uid, r.title]));
			const generation = currentGeneration(milestones);
			return {
				plant: {
					id: plant.id,
					cultivarName: found.cultivarName,
					plantedOn: plant.plantedOn,
					ageAtPlantingWeeks: plant.ageAtPlantingWeeks,
					climateName: found.climateName ?? (plant.customMonthlyMeanC ? 'your own monthly means' : null),
					climateSlug: found.climateSlug,
					units,
					archived: plant.archivedAt !== null,
					gardenerName: found.gardenerName,
					stageLabel: plant.stage && isPlantStage(plant.stage) ? stageLabel(plant.stage) : null,
					stageGuide: plant.stage && isPlantStage(plant.stage) ? stageGuideHref(plant.stage) : null,
					stemLabel: generationLabel(generation),
					generation
				},
				access: found.access,
				today,
				steps,
				agenda: agendaFor(steps, today),
				milestones: milestones.map((m) => ({
					id: m.id,
					kind: m.kind,
					label: MILESTONE_LABELS[m.kind],
					generation: m.generation,
					stem: generationLabel(m.generation),
					on: m.on,
					leaves: m.leaves,
					hands: m.hands,
					bunchMass: m.bunchMassG === null ? null : bunchMassText(m.bunchMassG, units),
					reason: m.lossReason ? LOSS_REASON_LABELS[m.lossReason] : null,
					reasonValue: m.lossReason,
					note: m.note,
					photo: m.photoId ? photoUrls(m.photoId) : null,
					dividedPlantId: m.dividedPlantId
				})),
				moved: changes.map((c) => ({
					title: titleOf.get(c.stepUid) ?? c.kind,
					stem: generationLabel(c.generation),
					to: c.toLikely,
					shift: describeShift(c.days),
					because: describeCause(c.cause)
				})),
				family
			};
		},

		/** Planting date, climate, units, archived: each change re-times the plan (archiving does not). */
		async update(viewer: Viewer, plantId: number, patch: PlantPatch): Promise<{ moved: Regeneration['moved'] }> {
			const { plant } = await editable(viewer, plantId);
			const values: Partial<PlantRow> = {};
			const causes: ChangeCause[] = [];
			if (patch.plantedOn !== undefined && patch.plantedOn !== plant.plantedOn) {
				values.plantedOn = patch.plantedOn;
				causes.push({ kind: 'planting-date', on: patch.plantedOn });
			}
			if (patch.climate !== undefined) {
				if (typeof patch.climate === 'string') {
					const profile = await deps.climateBySlug(patch.climate);
					if (!profile) throw new UserFacingError('climate', 'Unknown climate: choose one listed by GET /api/v1/climates, or give 12 monthly means');
					if (profile.id !== plant.climateProfileId) Object.assign(values, { climateProfileId: profile.id, customMonthlyMeanC: null });
				} else Object.assign(values, { climateProfileId: null, customMonthlyMeanC: patch.climate.monthlyMeanC });
				if ('climateProfileId' in values) causes.push({ kind: 'climate' });
			}
			if (patch.units !== undefined && patch.units !== plant.units) {
				values.units = patch.units;
				causes.push({ kind: 'units' });
			}
			if (patch.archived !== undefined) values.archivedAt = patch.archived ? (plant.archivedAt ?? new Date()) : null;
			return repo.transaction(async (tx) => {
				if (values.plantedOn) {
					const earliest = (await repo.milestones(plantId, tx))[0];
					if (earliest && earliest.on < values.plantedOn) {
						throw new UserFacingError('plantedOn', `A milestone is logged on ${formatDay(earliest.on)}: the plant was in the ground by then`);
					}
				}
				if (Object.keys(values).length > 0) await repo.updatePlant(tx, plantId, values);
				// One regeneration for all the changes, named after the first (the one a gardener changes most).
				const result = causes.length > 0 ? await deps.regenerate(tx, plantId, causes[0]!) : null;
				return { moved: result?.moved ?? [] };
			});
		},

		/** Logs a milestone (with an optional photo); a division also creates the new plant with its own plan. */
		async log(viewer: Viewer, plantId: number, input: MilestoneInput, photo?: File) {
			const { plant } = await editable(viewer, plantId);
			const today = await deps.today();
			const existing = await repo.milestones(plantId);
			checkDay(plant, input.on, today, input.kind, input.generation, existing);
			const values = kindValues(input.kind, input, plant.units ?? 'metric');
			const staged = photo && photo.size > 0 ? await deps.uploads.stage(photo, 'photo') : undefined;
			return inTransaction(staged, async (tx) => {
				const upload = staged ? await deps.uploads.record(tx, staged, { ownerId: viewer.id, purpose: 'milestone-photo', field: 'photo' }) : undefined;
				let dividedPlantId: number | null = null;
				if (input.kind === 'division') {
					const followers = (await repo.steps(plantId, tx)).find((s) => s.kind === 'followers' && s.generation === input.generation);
					const age = ageAtDivisionWeeks(followers?.likely, input.on);
					const division = await repo.insertPlant(tx, {
						cultivarId: plant.cultivarId,
						soldOn: input.on,
						ageAtSaleWeeks: age,
						claimedAt: new Date(),
						gardenerId: plant.gardenerId,
						plantedOn: input.on,
						ageAtPlantingWeeks: age,
						climateProfileId: plant.climateProfileId,
						customMonthlyMeanC: plant.customMonthlyMeanC,
						units: plant.units,
						parentPlantId: plant.id
					});
					await deps.regenerate(tx, division.id, { kind: 'created' });
					dividedPlantId = division.id;
				}
				const milestone = await repo.insertMilestone(tx, {
					plantId,
					generation: input.generation,
					kind: input.kind,
					on: input.on,
					...values,
					note: input.note ?? '',
					photoId: upload?.id ?? null,
					dividedPlantId,
					createdBy: viewer.id
				});
				const result = await deps.regenerate(tx, plantId, { kind: 'milestone-logged', milestoneKind: input.kind, on: input.on });
				return { milestone, moved: result?.moved ?? [], dividedPlantId };
			});
		},

		/** Corrects a milestone's day, values, note or photo; the plan follows. */
		async correct(viewer: Viewer, plantId: number, milestoneId: number, patch: MilestonePatch, photo?: File) {
			const { plant, milestone } = await milestoneOf(viewer, plantId, milestoneId, true);
			const on = patch.on ?? milestone.on;
			const others = (await repo.milestones(plantId)).filter((m) => m.id !== milestoneId);
			checkDay(plant, on, await deps.today(), milestone.kind, milestone.generation, others);
			const merged = {
				leaves: patch.leaves ?? milestone.leaves ?? undefined,
				hands: patch.hands ?? milestone.hands ?? undefined,
				reason: patch.reason ?? milestone.lossReason ?? undefined
			};
			const values = kindValues(milestone.kind, { ...merged, ...(patch.bunchMass !== undefined ? { bunchMass: patch.bunchMass } : {}) }, plant.units ?? 'metric');
			if (patch.bunchMass === undefined) values.bunchMassG = milestone.bunchMassG;
			const staged = photo && photo.size > 0 ? await deps.uploads.stage(photo, 'photo') : undefined;
			let removeOldPhoto: (() => Promise<void>) | undefined;
			const result = await inTransaction(staged, async (tx) => {
				const upload = staged ? await deps.uploads.record(tx, staged, { ownerId: viewer.id, purpose: 'milestone-photo', field: 'photo' }) : undefined;
				const updated = await repo.updateMilestone(tx, milestoneId, {
					on,
					...values,
					...(patch.note !== undefined ? { note: patch.note } : {}),
					...(upload ? { photoId: upload.id } : {})
				});
				if (upload && milestone.photoId) removeOldPhoto = await deps.uploads.remove(tx, milestone.photoId);
				const regen = await deps.regenerate(tx, plantId, { kind: 'milestone-corrected', milestoneKind: milestone.kind, on });
				return { milestone: updated, moved: regen?.moved ?? [] };
			});
			await removeOldPhoto?.();
			return result;
		},

		/** Deletes a milestone and its photo; a plant divided off keeps its own life. */
		async remove(viewer: Viewer, plantId: number, milestoneId: number) {
			const { milestone } = await milestoneOf(viewer, plantId, milestoneId, true);
			let removePhoto: (() => Promise<void>) | undefined;
			const result = await repo.transaction(async (tx) => {
				await repo.deleteMilestone(tx, milestoneId);
				if (milestone.photoId) removePhoto = await deps.uploads.remove(tx, milestone.photoId);
				const regen = await deps.regenerate(tx, plantId, { kind: 'milestone-deleted', milestoneKind: milestone.kind, on: milestone.on });
				return { moved: regen?.moved ?? [] };
			});
			await removePhoto?.();
			return result;
		},

		/** Whether the viewer may see a milestone photo: the same rule as the plant it belongs to. */
		async canSeePhoto(viewer: Viewer, uploadId: number): Promise<boolean> {
			const owner = await repo.milestoneOfPhoto(uploadId);
			return owner !== undefined && plantAccess(viewer, owner) !== 'none';
		}
	};
}
export type PlantService = ReturnType<typeof createPlantService>;

export const plantService = createPlantService({
	repo: plantRepository,
	regenerate: regeneratePlan,
	uploads,
	climateBySlug: catalogueService.climateBySlug,
	today: async () => todayIso(new Date(), (await nurseryService.planningContext()).timeZone)
});
