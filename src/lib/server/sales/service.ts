/**
 * Sales at the stall and the nursery. One sale takes plants from one batch, in one transaction:
 * the sale row (stored once per client id, so a resent sale lands once), a conditional decrement
 * of the batch (never below zero), a movement row, and one plant row per plant with its own
 * claim code. The claim links are e-mailed after the commit when the buyer gave an address.
 */
import { AGE_MAX_WEEKS } from '../../schema/plan';
import { fromCents, STOCK_LIMITS, toCents, type SaleInput } from '../../schema/stock';
import { formatDay } from '../../plan-text';
import { UserFacingError } from '../errors';
import { claimCode, claimCodeHash, claimPath } from '../plants/claim-code';
import type { AnyDb } from '../secrets';
import { stockRepository } from '../stock/repository';
import { ageInWeeks } from '../stock/service';
import { salesRepository, type SaleRow } from './repository';

export interface SaleMail {
	to: string;
	subject: string;
	text: string;
}

export interface SalesDeps {
	db: AnyDb;
	/** The claim-code key (see secrets.ts). */
	secret: () => Promise<string>;
	/** Absolute URL of a path on this site (always the configured origin). */
	link: (path: string) => string;
	/** Sends one message within the per-address mail limit; resolves false when it was not sent. */
	mail: (m: SaleMail) => Promise<boolean>;
	nursery: () => Promise<{ name: string; town: string }>;
}

export interface PlantLink {
	id: number;
	claimed: boolean;
	ageAtSaleWeeks: number;
	claimLink: string;
}

export interface SaleView {
	id: number;
	clientId: string;
	batchId: number | null;
	cultivar: { slug: string; name: string };
	soldOn: string;
	place: string | null;
	quantity: number;
	pricePerPlant: number;
	buyerEmail: string | null;
	undone: boolean;
	recordedAt: string;
	/** Until when DELETE /api/v1/sales/[id] (undo) is accepted. */
	undoableUntil: string;
}

const UNDO_MS = STOCK_LIMITS.undoMinutes * 60 * 1000;

export function saleView(s: SaleRow): SaleView {
	return {
		id: s.id,
		clientId: s.clientId,
		batchId: s.batchId,
		cultivar: { slug: s.cultivarSlug, name: s.cultivarName },
		soldOn: s.soldOn,
		place: s.place,
		quantity: s.quantity,
		pricePerPlant: fromCents(s.pricePerPlantCents),
		buyerEmail: s.buyerEmail,
		undone: s.undoneAt !== null,
		recordedAt: s.createdAt.toISOString(),
		undoableUntil: new Date(s.createdAt.getTime() + UNDO_MS).toISOString()
	};
}

export function claimMail(sale: Pick<SaleView, 'cultivar' | 'soldOn' | 'quantity'>, links: string[], nursery: { name: string; town: string }, to: string): SaleMail {
	const plural = sale.quantity === 1 ? 'plant' : 'plants';
	const lines = links.map((l, i) => (links.length === 1 ? l : `Plant ${i + 1}: ${l}`)).join('\n');
	return {
		to,
		subject: `Your ${sale.cultivar.name} from ${nursery.name}: claim its care plan`,
		text:
			`Hello,\n\nThank you for buying ${sale.quantity} ${sale.cultivar.name} ${plural} from ${nursery.name} on ${formatDay(sale.soldOn)}.\n` +
			`Each plant has its own care plan, timed to when and where it goes in the ground. Open the link, sign up or sign in, and tell us the planting date and your climate:\n\n` +
			`${lines}\n\nEach link works until its plant is claimed; keep it to yourself, since whoever claims the plant gets its plan.\n\n${nursery.name}, ${nursery.town}`
	};
}

/**
 * The plants of a sale, unclaimed, each with its own claim code: the one rule for creating sold
 * plants, used by the stall and by the import of past sales. Runs inside the caller's transaction.
 */
export async function insertSoldPlants(db: AnyDb, secret: string, sale: { saleId: number; cultivarId: number; soldOn: string; ageAtSaleWeeks: number; quantity: number }) {
	const sr = salesRepository(db);
	const rows = await sr.insertPlants(
		Array.from({ length: sale.quantity }, () => ({ saleId: sale.saleId, cultivarId: sale.cultivarId, soldOn: sale.soldOn, ageAtSaleWeeks: sale.ageAtSaleWeeks }))
	);
	for (const p of rows) await sr.setClaimHash(p.id, claimCodeHash(claimCode(secret, p.id, p.claimVersion)), p.claimVersion);
	return rows;
}

export function createSalesService(deps: SalesDeps) {
	const { db } = deps;
	const repo = salesRepository(db);

	async function links(saleId: number): Promise<PlantLink[]> {
		const secret = await deps.secret();
		return (await repo.plantsOfSale(saleId)).map((p) => ({ id: p.id, claimed: p.claimedAt !== null, ageAtSaleWeeks: p.ageAtSaleWeeks, claimLink: deps.link(claimPath(claimCode(secret, p.id, p.claimVersion))) }));
	}

	async function mailLinks(sale: SaleView, plants: PlantLink[], to: string): Promise<boolean> {
		const open = plants.filter((p) => !p.claimed);
		if (open.length === 0) return false;
		return deps.mail(claimMail(sale, open.map((p) => p.claimLink), await deps.nursery(), to));
	}

	return {
		/**
		 * Records a sale. Resolves `created: false` with the stored sale when this client id was
		 * already recorded (a resend after a lost answer). 409 when the batch has too few plants.
		 * `soldOn` is today in the nursery's time zone.
		 */
		async record(input: SaleInput, sellerId: number | null, soldOn: string) {
			const secret = await deps.secret();
			const outcome = await db.transaction(async (tx) => {
				const sr = salesRepository(tx);
				const st = stockRepository(tx);
				const batch = await st.batch(input.batchId);
				if (!batch) throw new UserFacingError('batchId', 'No such batch: choose a cultivar on hand', 404);
				const inserted = await sr.insertSale({
					clientId: input.clientId,
					batchId: batch.id,
					cultivarId: batch.cultivarId,
					marketDayId: batch.marketDayId,
					soldOn,
					quantity: input.quantity,
					pricePerPlantCents: toCents(input.pricePerPlant),
					buyerEmail: input.buyerEmail ?? null,
					soldBy: sellerId
				});
				if (!inserted) return { created: false as const };
				if (!(await st.changeCount(batch.id, -input.quantity))) {
					const left = (await st.batch(batch.id))!.onHand;
					throw new UserFacingError('quantity', left === 0 ? 'Sold out: this batch has no plants left' : `Only ${left} left in this batch`, 409);
				}
				await st.recordMovement({ batchId: batch.id, change: -input.quantity, kind: 'sold', reason: `sale ${inserted.id}`, userId: sellerId });
				const ageAtSaleWeeks = Math.min(AGE_MAX_WEEKS, Math.max(0, ageInWeeks(batch.pottedOn, soldOn)));
				await insertSoldPlants(tx, secret, { saleId: inserted.id, cultivarId: batch.cultivarId, soldOn, ageAtSaleWeeks, quantity: input.quantity });
				return { created: true as const, id: inserted.id };
			});
			const row = outcome.created ? await repo.sale(outcome.id) : await repo.saleByClientId(input.clientId);
			if (!row) throw new UserFacingError('clientId', 'This sale was recorded and then removed', 410);
			const sale = saleView(row);
			const plants = await links(sale.id);
			const mailed = outcome.created && sale.buyerEmail ? await mailLinks(sale, plants, sale.buyerEmail) : false;
			return { created: outcome.created, sale, plants, mailed };
		},

		async get(saleId: number) {
			const row = await repo.sale(saleId);
			if (!row) throw new UserFacingError('saleId', 'No such sale', 404);
			return { sale: saleView(row), plants: await links(saleId) };
		},

		/** The day's sales that stand, with their total, for the stall. */
		async day(on: string) {
			const rows = (await repo.salesOn(on)).map(saleView);
			const totalCents = rows.reduce((sum, s) => sum + toCents(s.pricePerPlant) * s.quantity, 0);
			return { sales: rows, total: fromCents(totalCents), plants: rows.reduce((n, s) => n + s.quantity, 0) };
		},

		/** Undo within the window: the plants go back on the batch and their records go. */
		async undo(saleId: number, userId: number | null, now = new Date()) {
			await db.transaction(async (tx) => {
				const sr = salesRepository(tx);
				const st = stockRepository(tx);
				const sale = await sr.sale(saleId);
				if (!sale) throw new UserFacingError('saleId', 'No such sale', 404);
				if (sale.undoneAt) throw new UserFacingError('saleId', 'This sale was already undone', 410);
				if ((await sr.claimedCount(saleId)) > 0) throw new UserFacingError('saleId', 'A plant of this sale has been claimed: it can no longer be undone', 409);
				if (!(await sr.markUndone(saleId, now, new Date(now.getTime() - UNDO_MS)))) {
					throw new UserFacingError('saleId', `A sale can be undone for ${STOCK_LIMITS.undoMinutes} minutes: adjust the stock instead`, 409);
				}
				await sr.deletePlantsOfSale(saleId);
				if (sale.batchId !== null) {
					await st.changeCount(sale.batchId, sale.quantity);
					await st.recordMovement({ batchId: sale.batchId, change: sale.quantity, kind: 'undone', reason: `sale ${saleId}`, userId });
				}
			});
			return saleView((await repo.sale(saleId))!);
		},

		/** E-mails the open claim links again, to the sale's buyer or to a newly given address. */
		async resend(saleId: number, email: string | undefined) {
			const row = await repo.sale(saleId);
			if (!row) throw new UserFacingError('saleId', 'No such sale', 404);
			if (row.undoneAt) throw new UserFacingError('saleId', 'This sale was undone', 410);
			const to = email ?? row.buyerEmail;
			if (!to) throw new UserFacingError('email', 'Enter the buyer’s e-mail address');
			if (email && email !== row.buyerEmail) await repo.setBuyerEmail(saleId, email);
			const plants = await links(saleId);
			if (plants.every((p) => p.claimed)) throw new UserFacingError('email', 'Every plant of this sale is already claimed', 409);
			if (!(await mailLinks(saleView(row), plants, to))) {
				throw new UserFacingError('email', 'The e-mail could not be sent just now (or this address had too many today): try again later', 503);
			}
			return to;
		},

		/** New codes for the unclaimed plants of a sale (a card lost or a link shared by mistake): the old ones stop working. */
		async reissue(saleId: number) {
			const secret = await deps.secret();
			await db.transaction(async (tx) => {
				const sr = salesRepository(tx);
				const sale = await sr.sale(saleId);
				if (!sale) throw new UserFacingError('saleId', 'No such sale', 404);
				if (sale.undoneAt) throw new UserFacingError('saleId', 'This sale was undone', 410);
				const open = (await sr.plantsOfSale(saleId)).filter((p) => !p.claimedAt).map((p) => p.id);
				if (open.length === 0) throw new UserFacingError('saleId', 'Every plant of this sale is already claimed', 409);
				for (const p of await sr.bumpClaimVersions(open)) await sr.setClaimHash(p.id, claimCodeHash(claimCode(secret, p.id, p.claimVersion)), p.claimVersion);
			});
			return links(saleId);
		}
	};
}

export type SalesService = ReturnType<typeof createSalesService>;
