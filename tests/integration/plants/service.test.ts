import { readdirSync, existsSync } from 'node:fs';
import { join } from 'node:path';
import { asc, eq } from 'drizzle-orm';
import { beforeAll, describe, expect, it } from 'vitest';
import { db } from '../../../src/lib/server/db';
import { milestones, planSteps, plants, uploads as uploadTable } from '../../../src/lib/server/db/schema';
import { plantService } from '../../../src/lib/server/plants/plant-service';
import { uploads } from '../../../src/lib/server/uploads';
import { config } from '../../../src/lib/server/config';
import { UPLOAD_LIMITS } from '../../../src/lib/uploads';
import { gpsOf, oversizedJpeg, phonePhotoWithGps, pixelBombPng, scriptAsJpeg } from '../../helpers/images';
import { insertGardener, insertPlant } from '../../helpers/plants';

const stepsOf = (plantId: number) => db.select().from(planSteps).where(eq(planSteps.plantId, plantId)).orderBy(asc(planSteps.likely), asc(planSteps.uid));
const file = (bytes: Buffer, name: string, type: string) => new File([new Uint8Array(bytes)], name, { type });
const storedFiles = (): string[] => (existsSync(config.uploadDir) ? readdirSync(config.uploadDir, { recursive: true, withFileTypes: true }).filter((e) => e.isFile()).map((e) => join(e.parentPath, e.name)) : []);
const counts = async (plantId: number, ownerId: number) => ({
	milestones: (await db.select().from(milestones).where(eq(milestones.plantId, plantId))).length,
	uploads: (await db.select().from(uploadTable).where(eq(uploadTable.ownerId, ownerId))).length,
	files: storedFiles().length
});
const isoDaysAfter = (iso: string, days: number) => new Date(Date.parse(iso) + days * 86_400_000).toISOString().slice(0, 10);

let pim: Awaited<ReturnType<typeof insertGardener>>;
let sol: Awaited<ReturnType<typeof insertGardener>>;
let staff: Awaited<ReturnType<typeof insertGardener>>;
// Planted long enough ago that the flower can be logged today or earlier.
const plantedOn = isoDaysAfter(new Date().toISOString().slice(0, 10), -400);

beforeAll(async () => {
	[pim, sol, staff] = await Promise.all([insertGardener('Pim'), insertGardener('Sol'), insertGardener('Ines', 'staff')]);
});

describe('logging a milestone', () => {
	it('a shooting day with a phone photo moves the harvest, and the stored photo has no GPS position', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const harvest = (await stepsOf(plant.id)).find((s) => s.kind === 'harvest' && s.generation === 0)!;
		const on = isoDaysAfter(plantedOn, 380);
		const photo = await phonePhotoWithGps();
		expect(gpsOf(photo)).toBeDefined();
		const result = await plantService.log(pim, plant.id, { kind: 'shooting', on, generation: 0, note: 'Purple bud out' }, file(photo, 'IMG_0042.jpg', 'image/jpeg'));
		const move = result.moved.find((m) => m.uid === harvest.uid)!;
		expect(move.days).not.toBe(0);
		expect(move.fromLikely).toBe(harvest.likely);
		const upload = await uploads.byId(result.milestone.photoId!);
		expect(upload?.ownerId).toBe(pim.id);
		for (const variant of ['display', 'thumbnail'] as const) {
			const stored = await uploads.read(upload!, variant);
			expect(stored!.subarray(0, 3)).toEqual(Buffer.from([0xff, 0xd8, 0xff]));
			expect(gpsOf(stored!)).toBeUndefined();
		}
		const [row] = await db.select().from(plants).where(eq(plants.id, plant.id));
		expect(row!.lastMilestoneKind).toBe('shooting');
	});

	for (const [what, make, message] of [
		['a script disguised as .jpg', async () => file(scriptAsJpeg(), 'holiday.jpg', 'image/jpeg'), /not a JPEG, PNG or WebP/],
		['an oversized file', async () => file(await oversizedJpeg(UPLOAD_LIMITS.fileBytes), 'big.jpg', 'image/jpeg'), /up to 10 MB/],
		['a pixel bomb', async () => file(pixelBombPng(), 'bomb.png', 'image/png'), /megapixels/]
	] as const) {
		it(`${what} is refused with a clear message and nothing is stored`, async () => {
			const plant = await insertPlant({ gardenerId: sol.id, plantedOn });
			const before = await counts(plant.id, sol.id);
			const stepsBefore = await stepsOf(plant.id);
			await expect(plantService.log(sol, plant.id, { kind: 'flag-leaf', on: isoDaysAfter(plantedOn, 300), generation: 0 }, await make())).rejects.toMatchObject({ field: 'photo', message: expect.stringMatching(message) });
			expect(await counts(plant.id, sol.id)).toEqual(before);
			expect(await stepsOf(plant.id)).toEqual(stepsBefore);
		});
	}

	it('refuses a day before planting or in the future, naming the field, and writes nothing', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const forecast = await stepsOf(plant.id);
		await expect(plantService.log(pim, plant.id, { kind: 'shooting', on: isoDaysAfter(plantedOn, -1), generation: 0 })).rejects.toMatchObject({ field: 'on', status: 400 });
		await expect(plantService.log(pim, plant.id, { kind: 'shooting', on: isoDaysAfter(new Date().toISOString().slice(0, 10), 2), generation: 0 })).rejects.toMatchObject({ field: 'on' });
		expect(await stepsOf(plant.id)).toEqual(forecast);
		await plantService.log(pim, plant.id, { kind: 'shooting', on: isoDaysAfter(plantedOn, 300), generation: 0 });
		const afterShooting = await stepsOf(plant.id);
		await expect(plantService.log(pim, plant.id, { kind: 'harvest', on: isoDaysAfter(plantedOn, 299), generation: 0 })).rejects.toMatchObject({ field: 'on', message: expect.stringMatching(/harvest comes after/) });
		expect((await db.select().from(milestones).where(eq(milestones.plantId, plant.id))).length).toBe(1);
		expect(await stepsOf(plant.id)).toEqual(afterShooting);
	});

	it("a milestone logged on a follower re-times that follower's own steps", async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const harvestOf = async (generation: number) => (await stepsOf(plant.id)).find((s) => s.kind === 'harvest' && s.generation === generation)!;
		const [motherBefore, followerBefore] = [await harvestOf(0), await harvestOf(1)];
		// The follower flowers far earlier than forecast: its harvest comes forward, the mother's stays.
		const shot = isoDaysAfter(plantedOn, 390);
		expect(shot < followerBefore.likely).toBe(true);
		await plantService.log(pim, plant.id, { kind: 'shooting', on: shot, generation: 1 });
		const [motherAfter, followerAfter] = [await harvestOf(0), await harvestOf(1)];
		expect(motherAfter.likely).toBe(motherBefore.likely);
		expect(followerAfter.likely < followerBefore.likely).toBe(true);
		expect(followerAfter.uid).toBe(followerBefore.uid);
	});

	it('a correction and a deletion re-time the plan; deleting brings the forecast back with the same uids', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const forecast = await stepsOf(plant.id);
		const harvest = forecast.find((s) => s.kind === 'harvest' && s.generation === 0)!;
		const logged = await plantService.log(pim, plant.id, { kind: 'shooting', on: isoDaysAfter(plantedOn, 330), generation: 0 });
		const corrected = await plantService.correct(pim, plant.id, logged.milestone.id, { on: isoDaysAfter(plantedOn, 340) });
		expect(corrected.moved.find((m) => m.uid === harvest.uid)?.days).toBeGreaterThan(0);
		await plantService.remove(pim, plant.id, logged.milestone.id);
		const after = await stepsOf(plant.id);
		const byUid = (rows: typeof after) => Object.fromEntries(rows.map((s) => [s.uid, s.likely]));
		expect(byUid(after)).toEqual(byUid(forecast));
		expect(after.find((s) => s.uid === harvest.uid)!.sequence).toBe(3);
	});

	it('a harvest on the mother hands the mat on to the follower', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		await plantService.log(pim, plant.id, { kind: 'shooting', on: isoDaysAfter(plantedOn, 250), generation: 0 });
		await plantService.log(pim, plant.id, { kind: 'harvest', on: isoDaysAfter(plantedOn, 380), generation: 0, hands: 9, bunchMass: 24.5 });
		const view = await plantService.page(pim, plant.id);
		expect(view.plant.generation).toBe(1);
		expect(view.plant.stemLabel).not.toBe(view.milestones[0]!.stem);
		expect(view.milestones.find((m) => m.kind === 'harvest')?.bunchMass).toBe('24.5 kg');
	});
});

describe('division', () => {
	it('creates a new plant for the same gardener and garden, with the follower’s age, its own plan and a link to the mat', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn, units: 'imperial' });
		const followers = (await stepsOf(plant.id)).find((s) => s.kind === 'followers' && s.generation === 0)!;
		const on = isoDaysAfter(followers.likely, 70);
		const { dividedPlantId } = await plantService.log(pim, plant.id, { kind: 'division', on, generation: 0 });
		const [child] = await db.select().from(plants).where(eq(plants.id, dividedPlantId!));
		expect(child).toMatchObject({ gardenerId: pim.id, parentPlantId: plant.id, plantedOn: on, ageAtPlantingWeeks: 10, climateProfileId: plant.climateProfileId, units: 'imperial', cultivarId: plant.cultivarId });
		const childSteps = await stepsOf(child!.id);
		expect(childSteps.length).toBeGreaterThan(30);
		expect(childSteps[0]).toMatchObject({ kind: 'planting', likely: on });
		const family = (await plantService.page(pim, child!.id)).family;
		expect(family.parent?.id).toBe(plant.id);
		expect((await plantService.page(pim, plant.id)).family.children.map((c) => c.id)).toEqual([child!.id]);
	});
});

describe('who may see and change a plant', () => {
	it('another gardener gets 404 for the plant, its milestones and its photo; staff read but cannot change', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const { milestone } = await plantService.log(pim, plant.id, { kind: 'flag-leaf', on: isoDaysAfter(plantedOn, 200), generation: 0 }, file(await phonePhotoWithGps(), 'a.jpg', 'image/jpeg'));
		const notFound = { status: 404 };
		await expect(plantService.detail(sol, plant.id)).rejects.toMatchObject(notFound);
		await expect(plantService.page(sol, plant.id)).rejects.toMatchObject(notFound);
		await expect(plantService.update(sol, plant.id, { archived: true })).rejects.toMatchObject(notFound);
		await expect(plantService.log(sol, plant.id, { kind: 'shooting', on: isoDaysAfter(plantedOn, 300), generation: 0 })).rejects.toMatchObject(notFound);
		await expect(plantService.correct(sol, plant.id, milestone.id, { note: 'mine now' })).rejects.toMatchObject(notFound);
		await expect(plantService.remove(sol, plant.id, milestone.id)).rejects.toMatchObject(notFound);
		expect(await plantService.canSeePhoto(sol, milestone.photoId!)).toBe(false);
		expect(await plantService.canSeePhoto(pim, milestone.photoId!)).toBe(true);
		expect(await plantService.canSeePhoto(staff, milestone.photoId!)).toBe(true);
		// A milestone of another plant is not found through this one.
		const other = await insertPlant({ gardenerId: sol.id, plantedOn });
		await expect(plantService.correct(sol, other.id, milestone.id, { note: 'x' })).rejects.toMatchObject(notFound);
		expect((await plantService.detail(staff, plant.id)).milestones.length).toBe(1);
		await expect(plantService.update(staff, plant.id, { archived: true })).rejects.toMatchObject({ status: 403 });
		expect((await db.select().from(milestones).where(eq(milestones.id, milestone.id)))[0]!.note).toBe('');
	});
});

describe('plant settings', () => {
	it('a new planting date re-times the plan and keeps every uid; one before a logged milestone is refused', async () => {
		const plant = await insertPlant({ gardenerId: pim.id, plantedOn });
		const before = await stepsOf(plant.id);
		const { moved } = await plantService.update(pim, plant.id, { plantedOn: isoDaysAfter(plantedOn, 14) });
		expect(moved.length).toBeGreaterThan(5);
		const after = await stepsOf(plant.id);
		const uids = new Set(before.map((s) => s.uid));
		expect(after.filter((s) => s.kind !== 'feeding').every((s) => uids.has(s.uid))).toBe(true);
		await plantService.log(pim, plant.id, { kind: 'flag-leaf', on: isoDaysAfter(plantedOn, 30), generation: 0 });
		await expect(plantService.update(pim, plant.id, { plantedOn: isoDaysAfter(plantedOn, 40) })).rejects.toMatchObject({ field: 'plantedOn' });
		await expect(plantService.update(pim, plant.id, { climate: 'no-such-climate' })).rejects.toMatchObject({ field: 'climate' });
	});
});
