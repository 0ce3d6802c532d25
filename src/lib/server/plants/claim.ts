/**
 * Claiming a plant with the code from its care card or e-mail. Every look-up and claim counts
 * against the address's limit, like sign-in, so codes cannot be guessed at speed (they carry 160
 * bits anyway). Unknown code: 404; claimed already: 410; never a 500.
 */
import { parseIsoDate, formatIsoDate } from '../../care';
import { AGE_MAX_WEEKS } from '../../schema/plan';
import { CLAIM_CODE, CUSTOM_CLIMATE_CHOICE, STOCK_LIMITS, type ClaimInput } from '../../schema/stock';
import type { Limit } from '../auth/rate-limit';
import { UserFacingError } from '../errors';
import type { AnyDb } from '../secrets';
import { claimCodeHash } from './claim-code';
import { plantsRepository } from './repository';

const MINUTE = 60 * 1000;
/** As many as sign-in allows one address: a household claiming a trayful stays well inside. */
export const CLAIM_LIMIT: Limit = { limit: 30, windowMs: 15 * MINUTE };
export const claimLimitKey = (ip: string) => `claim-ip:${ip}`;

export interface ClaimDeps {
	db: AnyDb;
	/** Counts an attempt for a key within a limit (src/lib/server/auth/rate-limit.ts). */
	consume: (key: string, rule: Limit) => Promise<{ allowed: boolean }>;
	climateBySlug: (slug: string) => Promise<{ id: number } | undefined>;
	/** Runs after a claim commits (the stored plan hooks in here). */
	afterClaim?: (plantId: number) => Promise<void>;
}

export const addDays = (iso: string, days: number) => formatIsoDate(parseIsoDate(iso) + days);

/** The planting date the claim form suggests: a few days after the sale, but not before today's sale day. */
export const defaultPlantingDate = (soldOn: string) => addDays(soldOn, STOCK_LIMITS.plantingAfterSaleDays);

export function createClaimService({ db, consume, climateBySlug, afterClaim }: ClaimDeps) {
	const repo = plantsRepository(db);

	async function find(code: string, ip: string) {
		if (!(await consume(claimLimitKey(ip), CLAIM_LIMIT)).allowed) {
			throw new UserFacingError('code', 'Too many claim attempts from this connection: wait 15 minutes and try again', 429);
		}
		const plant = CLAIM_CODE.test(code) ? await repo.byClaimHash(claimCodeHash(code)) : undefined;
		if (!plant) throw new UserFacingError('code', 'No plant has this claim code: check the link on the card or in the e-mail, or ask the nursery for a new one', 404);
		return plant;
	}

	return {
		/** What the claim page shows; 410 once claimed (with who claimed it, so its owner gets a way on). */
		async lookup(code: string, ip: string, userId: number | null) {
			const plant = await find(code, ip);
			if (plant.claimedAt) {
				const yours = userId !== null && plant.gardenerId === userId;
				throw new UserFacingError('code', yours ? 'You have claimed this plant already: it is on your plants page' : 'This plant has been claimed already: each code works once', 410);
			}
			return { cultivarName: plant.cultivarName, soldOn: plant.soldOn, ageAtSaleWeeks: plant.ageAtSaleWeeks, defaultPlantedOn: defaultPlantingDate(plant.soldOn) };
		},

		async claim(code: string, gardenerId: number, input: ClaimInput, ip: string, today: string, now = new Date()) {
			const plant = await find(code, ip);
			if (plant.claimedAt) throw new UserFacingError('code', 'This plant has been claimed already: each code works once', 410);
			if (input.plantedOn < plant.soldOn) throw new UserFacingError('plantedOn', 'The planting date cannot be before the sale');
			if (input.plantedOn > addDays(today, STOCK_LIMITS.plantingAheadDays)) {
				throw new UserFacingError('plantedOn', `Give a planting date within ${STOCK_LIMITS.plantingAheadDays} days from today`);
			}
			let climateProfileId: number | null = null;
			if (input.climate !== CUSTOM_CLIMATE_CHOICE) {
				const profile = await climateBySlug(input.climate);
				if (!profile) throw new UserFacingError('climate', 'Unknown climate: choose one from the list, or give your own monthly means');
				climateProfileId = profile.id;
			}
			const weeksInPot = Math.floor((parseIsoDate(input.plantedOn) - parseIsoDate(plant.soldOn)) / 7);
			const claimed = await repo.claim(claimCodeHash(code), {
				gardenerId,
				claimedAt: now,
				plantedOn: input.plantedOn,
				ageAtPlantingWeeks: Math.min(AGE_MAX_WEEKS, plant.ageAtSaleWeeks + weeksInPot),
				climateProfileId,
				customMonthlyMeanC: climateProfileId === null ? (input.monthlyMeanC ?? null) : null,
				units: input.units
			});
			if (!claimed) throw new UserFacingError('code', 'This plant has been claimed already: each code works once', 410);
			await afterClaim?.(claimed.id);
			return claimed.id;
		}
	};
}

export type ClaimService = ReturnType<typeof createClaimService>;
