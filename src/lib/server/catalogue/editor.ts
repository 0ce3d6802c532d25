/**
 * The owner's changes to the catalogue and the nursery settings. Every write runs in one
 * transaction that also raises the catalogue version, so every app instance's cached catalogue
 * (service.ts) follows at its next read. Cultivar changes are recorded field by field.
 */
import { applyCultivarEdit, newCultivarParameters, slugify, toCents, type CultivarEdit } from '$lib/catalogue/changes';
import type { ClimateForm, CultivarForm, SettingsForm } from '$lib/schema/catalogue';
import { CUSTOM_CLIMATE } from '$lib/schema/plan';
import { UserFacingError } from '../errors';
import type { Tx } from '../db/tx';
import { editingRepository, type EditingRepository } from './editing-repository';

/** Slugs a nursery's own climate may not take: they mean something else in the planner's query string. */
const RESERVED_CLIMATE_SLUGS = new Set([CUSTOM_CLIMATE]);

const notFound = (what: 'cultivar' | 'climate') => new UserFacingError(what, `No such ${what}`, 404);

async function freeSlug(tx: Tx, name: string, taken: (tx: Tx, slug: string) => Promise<boolean>, reserved = new Set<string>()): Promise<string> {
	const base = slugify(name);
	// Few names collide, so asking one slug at a time is cheaper than listing them all.
	for (let i = 1; ; i++) {
		const candidate = i === 1 ? base : `${base}-${i}`;
		if (!reserved.has(candidate) && !(await taken(tx, candidate))) return candidate;
	}
}

export function createCatalogueEditor(repo: EditingRepository) {
	return {
		async addCultivar(form: CultivarForm, userId: number): Promise<string> {
			return repo.transaction(async (tx) => {
				const slug = await freeSlug(tx, form.name, repo.cultivarSlugTaken);
				const row = await repo.insertCultivar(tx, {
					slug,
					name: form.name,
					group: form.group,
					subgroup: form.subgroup,
					size: form.size,
					notes: form.notes,
					usualPriceCents: toCents(form.usualPrice),
					parameters: newCultivarParameters(form as CultivarEdit),
					builtIn: false
				});
				await repo.insertChanges(tx, [{ cultivarId: row.id, userId, field: 'created', oldValue: null, newValue: form.name }]);
				await repo.bumpVersion(tx);
				return slug;
			});
		},

		/** Returns how many fields changed (0 when the form matched what was stored). */
		async editCultivar(slug: string, form: CultivarForm, userId: number): Promise<number> {
			return repo.transaction(async (tx) => {
				const row = await repo.lockCultivar(tx, slug);
				if (!row) throw notFound('cultivar');
				const { next, changes } = applyCultivarEdit(row, form as CultivarEdit);
				if (changes.length === 0) return 0;
				const { name, group, subgroup, size, notes, usualPriceCents, parameters } = next;
				await repo.updateCultivar(tx, row.id, { name, group, subgroup, size, notes, usualPriceCents, parameters });
				await repo.insertChanges(tx, changes.map((c) => ({ cultivarId: row.id, userId, ...c })));
				await repo.bumpVersion(tx);
				return changes.length;
			});
		},

		/** Retired: not offered on the planner, the stall or the public catalogue; plants already sold keep it. */
		async setRetired(slug: string, retire: boolean, userId: number): Promise<boolean> {
			return repo.transaction(async (tx) => {
				const row = await repo.lockCultivar(tx, slug);
				if (!row) throw notFound('cultivar');
				const wasRetired = row.retiredAt !== null;
				if (wasRetired === retire) return false;
				await repo.updateCultivar(tx, row.id, { retiredAt: retire ? new Date() : null });
				await repo.insertChanges(tx, [{ cultivarId: row.id, userId, field: 'retired', oldValue: wasRetired, newValue: retire }]);
				await repo.bumpVersion(tx);
				return true;
			});
		},

		async history(cultivarId: number, page: number, size: number) {
			const total = await repo.historyCount(cultivarId);
			const last = Math.max(1, Math.ceil(total / size));
			const shown = Math.min(page, last);
			return { total, page: shown, size, rows: await repo.history(cultivarId, size, (shown - 1) * size) };
		},

		plantsOfCultivar: (cultivarId: number) => repo.plantsOfCultivar(cultivarId),

		async addClimate(form: ClimateForm, userId: number): Promise<string> {
			return repo.transaction(async (tx) => {
				if (await repo.climateNameTaken(tx, form.name)) throw new UserFacingError('name', 'A climate profile has this name already: choose another', 409);
				const slug = await freeSlug(tx, form.name, repo.climateSlugTaken, RESERVED_CLIMATE_SLUGS);
				await repo.insertClimate(tx, {
					slug,
					name: form.name,
					monthlyMeanC: form.monthlyMeanC,
					source: { kind: 'nursery', note: form.sourceNote },
					builtIn: false,
					createdBy: userId
				});
				await repo.bumpVersion(tx);
				return slug;
			});
		},

		async editClimate(slug: string, form: ClimateForm): Promise<void> {
			await repo.transaction(async (tx) => {
				const row = await repo.lockClimate(tx, slug);
				if (!row) throw notFound('climate');
				if (row.builtIn) throw new UserFacingError('form', 'Built-in climate profiles follow the engine: add a profile of your own instead', 403);
				if (await repo.climateNameTaken(tx, form.name, row.id)) throw new UserFacingError('name', 'A climate profile has this name already: choose another', 409);
				await repo.updateClimate(tx, row.id, { name: form.name, monthlyMeanC: form.monthlyMeanC, source: { kind: 'nursery', note: form.sourceNote } });
				await repo.bumpVersion(tx);
			});
		},

		/** Who depends on a climate: refused deletes say so before the owner confirms. */
		async climateUsage(climateId: number, slug: string, defaultClimate: string) {
			return { plants: await repo.plantsInClimate(climateId), isDefault: slug === defaultClimate };
		},

		async deleteClimate(slug: string): Promise<void> {
			await repo.transaction(async (tx) => {
				const row = await repo.lockClimate(tx, slug);
				if (!row) throw notFound('climate');
				if (row.builtIn) throw new UserFacingError('form', 'Built-in climate profiles cannot be deleted', 403);
				const settings = await repo.lockSettings(tx);
				if (settings?.defaultClimate === slug) throw new UserFacingError('form', "This is the nursery's default climate: choose another in the settings first", 409);
				const growing = await repo.plantsInClimate(row.id, tx);
				if (growing > 0) throw new UserFacingError('form', `${growing} ${growing === 1 ? 'plant grows' : 'plants grow'} in this climate and their plans use it: it cannot be deleted`, 409);
				await repo.deleteClimate(tx, row.id);
				await repo.bumpVersion(tx);
			});
		},

		async saveSettings(form: SettingsForm): Promise<void> {
			await repo.transaction(async (tx) => {
				if (!(await repo.climateSlugTaken(tx, form.defaultClimate))) throw new UserFacingError('defaultClimate', 'Choose a climate from the list');
				await repo.lockSettings(tx);
				await repo.saveSettings(tx, {
					name: form.name,
					town: form.town,
					market: form.market,
					timeZone: form.timeZone,
					units: form.units,
					defaultClimate: form.defaultClimate,
					fertilizerName: form.fertilizerName,
					npk: [form.npkN, form.npkP, form.npkK],
					fullRationG: form.fullRationG,
					handfulG: form.handfulG,
					restrictedMonths: [...new Set(form.restrictedMonths)].sort((a, b) => a - b),
					nitrogenCapKgPer100m2: form.nitrogenCapKgPer100m2 ?? null
				});
				await repo.bumpVersion(tx);
			});
		}
	};
}

export const catalogueEditor = createCatalogueEditor(editingRepository);
