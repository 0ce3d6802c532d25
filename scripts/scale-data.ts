/**
 * Fills a database with N sold plants, their sales, gardeners and stored plan steps, streamed
 * through PostgreSQL's COPY, for measuring the nursery's table at scale. Every plant is derived
 * from its number alone (a seeded generator), so each table is written in one pass without
 * holding anything in memory. Used by `npm run seed:scale` and the index test.
 */
import { Readable } from 'node:stream';
import { pipeline } from 'node:stream/promises';
import type postgres from 'postgres';
import { computePlan, cultivars as engineCultivars, defaultFeeding, findClimate, formatIsoDate, parseIsoDate, referenceClimateSlug, type Step } from '../src/lib/care';
import { STAGE_OF_STEP } from '../src/lib/care';

/** Share of plants sold that a gardener has claimed (and so has a stored plan). */
const CLAIMED_SHARE = 0.6;
/** Share of claimed plants whose gardener is behind, so the next step is overdue. */
const BEHIND_SHARE = 0.15;
/** Share of sales made on a market day; the rest at the nursery gate. */
const MARKET_SHARE = 0.8;
const PLANTS_PER_GARDENER = 2.5;
const AGES_AT_SALE = [4, 12, 26];
const YEARS_OF_SALES = 3;
const TEMPLATE_DAY = '2024-01-01';
const BATCH_ROWS = 2000;

/** mulberry32: a small, fast, seedable generator; quality is ample for spreading test data. */
function generator(seed: number) {
	let a = seed >>> 0;
	return () => {
		a = (a + 0x6d2b79f5) >>> 0;
		let t = a;
		t = Math.imul(t ^ (t >>> 15), t | 1);
		t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
		return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
	};
}

/** COPY's text format: tab-separated, \N for null, backslash escapes. */
function copyValue(v: string | number | boolean | null): string {
	if (v === null) return '\\N';
	if (typeof v !== 'string') return String(v);
	return v.replace(/\\/g, '\\\\').replace(/\t/g, '\\t').replace(/\n/g, '\\n').replace(/\r/g, '\\r');
}
const copyLine = (values: (string | number | boolean | null)[]) => values.map(copyValue).join('\t') + '\n';

interface TemplateStep {
	generation: number;
	kind: string;
	occurrence: number;
	title: string;
	earliest: number;
	likely: number;
	latest: number;
	amount: string | null;
	guide: string | null;
}

/** One engine plan per cultivar and age at sale, as offsets in days from planting, shifted onto each plant. */
function planTemplates(): TemplateStep[][][] {
	const climate = findClimate(referenceClimateSlug)!;
	const base = parseIsoDate(TEMPLATE_DAY);
	return engineCultivars.map((cultivar) =>
		AGES_AT_SALE.map((age) => {
			const steps: Step[] = computePlan({ cultivar, plantedOn: TEMPLATE_DAY, ageAtPlantingWeeks: age, climate, feeding: defaultFeeding }).steps;
			const seen = new Map<string, number>();
			return steps.map((s) => {
				const key = `${s.generation}|${s.kind}`;
				const occurrence = seen.get(key) ?? 0;
				seen.set(key, occurrence + 1);
				return {
					generation: s.generation,
					kind: s.kind,
					occurrence,
					title: s.title,
					earliest: parseIsoDate(s.earliest) - base,
					likely: parseIsoDate(s.likely) - base,
					latest: parseIsoDate(s.latest) - base,
					amount: s.amount ? JSON.stringify(s.amount) : null,
					guide: s.guide ?? null
				};
			});
		})
	);
}

export interface ScaleContext {
	n: number;
	today: number;
	cultivarIds: number[];
	firstGardenerId: number;
	gardeners: number;
	firstPlantId: number;
	firstSaleId: number;
	marketDays: { id: number; day: number }[];
	templates: TemplateStep[][][];
}

interface PlantFacts {
	id: number;
	saleId: number;
	cultivar: number;
	ageIndex: number;
	soldOn: number;
	marketDayId: number | null;
	gardenerId: number | null;
	plantedOn: number | null;
	behind: boolean;
}

/** Everything about plant number i, from i alone. */
function plantFacts(ctx: ScaleContext, i: number): PlantFacts {
	const r = generator(i * 2654435761 + 17);
	const cultivar = Math.floor(r() * ctx.cultivarIds.length);
	const ageIndex = Math.floor(r() * AGES_AT_SALE.length);
	let soldOn = ctx.today - Math.floor(r() * 365 * YEARS_OF_SALES);
	let marketDayId: number | null = null;
	if (r() < MARKET_SHARE && ctx.marketDays.length > 0) {
		const m = ctx.marketDays[Math.floor(r() * ctx.marketDays.length)];
		marketDayId = m.id;
		soldOn = m.day;
	}
	const claimed = r() < CLAIMED_SHARE;
	return {
		id: ctx.firstPlantId + i,
		saleId: ctx.firstSaleId + i,
		cultivar,
		ageIndex,
		soldOn,
		marketDayId,
		gardenerId: claimed ? ctx.firstGardenerId + (i % ctx.gardeners) : null,
		plantedOn: claimed ? soldOn + Math.floor(r() * 14) : null,
		behind: r() < BEHIND_SHARE
	};
}

/** What the plant row keeps from its plan: stage, next step, last milestone (as the plan regeneration would). */
function planSummary(ctx: ScaleContext, p: PlantFacts) {
	if (p.plantedOn === null) return { stage: null, nextOn: null, nextKind: null, lastOn: null, lastKind: null };
	const steps = ctx.templates[p.cultivar][p.ageIndex];
	// A gardener who is behind still has a step from up to a month ago waiting.
	const from = p.behind ? ctx.today - 30 : ctx.today;
	const next = steps.find((s) => p.plantedOn! + s.likely >= from);
	const done = [...steps].reverse().find((s) => s.kind !== 'feeding' && p.plantedOn! + s.likely < from);
	const stageStep = next ?? steps[steps.length - 1];
	return {
		stage: stageStep.kind === 'feeding' ? 'growing-leaves' : STAGE_OF_STEP[stageStep.kind as keyof typeof STAGE_OF_STEP],
		nextOn: next ? formatIsoDate(p.plantedOn + next.likely) : null,
		nextKind: next?.kind ?? null,
		lastOn: done ? formatIsoDate(p.plantedOn + done.likely) : null,
		lastKind: done?.kind ?? null
	};
}

/** Rows in batches of text, so COPY gets large writes and backpressure holds memory flat. */
function copyStream(count: number, rows: (i: number) => string): Readable {
	return Readable.from(
		(function* () {
			for (let start = 0; start < count; start += BATCH_ROWS) {
				let chunk = '';
				for (let i = start; i < Math.min(count, start + BATCH_ROWS); i++) chunk += rows(i);
				yield chunk;
			}
		})()
	);
}

async function copyInto(sql: postgres.Sql, table: string, columns: string[], count: number, rows: (i: number) => string) {
	const writable = await sql.unsafe(`copy ${table} (${columns.join(', ')}) from stdin`).writable();
	await pipeline(copyStream(count, rows), writable);
}

async function nextId(sql: postgres.Sql, table: string): Promise<number> {
	const [row] = await sql.unsafe(`select coalesce(max(id), 0) + 1 as id from ${table}`);
	return Number(row.id);
}

/** Moves the identity past the ids COPY wrote, so the app's own inserts keep working. */
async function syncIdentity(sql: postgres.Sql, table: string) {
	await sql.unsafe(`select setval(pg_get_serial_sequence('${table}', 'id'), (select max(id) from ${table}))`);
}

export interface FillOptions {
	today: string;
	log?: (message: string) => void;
	/** Write the plan steps too (default); the index test needs only the plant rows. */
	steps?: boolean;
}

/** Writes N plants with their sales, gardeners, market days and stored plan steps. Returns the step count. */
export async function fillScaleData(sql: postgres.Sql, n: number, { today, log = () => {}, steps: withSteps = true }: FillOptions): Promise<{ plants: number; steps: number }> {
	const todayDay = parseIsoDate(today);
	const cultivarRows = await sql<{ id: number }[]>`select id from cultivars where slug in ${sql(engineCultivars.map((c) => c.slug))} order by id`;
	if (cultivarRows.length !== engineCultivars.length) throw new Error('The built-in cultivars are missing: run the migrations first');

	// Saturdays over the years of sales, at the market.
	const firstSaturday = todayDay - YEARS_OF_SALES * 365 - ((todayDay - YEARS_OF_SALES * 365 + 4) % 7) + 2;
	const saturdays: number[] = [];
	for (let d = firstSaturday; d <= todayDay; d += 7) saturdays.push(d);
	const marketDays = await sql<{ id: number; on: string }[]>`
		insert into market_days ${sql(saturdays.map((d) => ({ on: formatIsoDate(d), place: 'Marrowby Quay Saturday Market' })))}
		on conflict ("on", place) do update set place = excluded.place
		returning id, "on"::text as "on"`;

	const gardeners = Math.max(1, Math.ceil((n * CLAIMED_SHARE) / PLANTS_PER_GARDENER));
	const ctx: ScaleContext = {
		n,
		today: todayDay,
		cultivarIds: cultivarRows.map((r) => r.id),
		firstGardenerId: await nextId(sql, 'users'),
		gardeners,
		firstPlantId: await nextId(sql, 'plants'),
		firstSaleId: await nextId(sql, 'sales'),
		marketDays: marketDays.map((m) => ({ id: m.id, day: parseIsoDate(m.on) })),
		templates: planTemplates()
	};
	const tag = Date.now().toString(36);
	const verifiedAt = new Date().toISOString();

	log(`gardeners: ${gardeners.toLocaleString('en')}`);
	await copyInto(sql, 'users', ['id', 'email', 'name', 'password_hash', 'role', 'email_verified_at'], gardeners, (i) =>
		copyLine([ctx.firstGardenerId + i, `scale-${tag}-${i}@example.test`, `Gardener ${i + 1}`, '!', 'gardener', verifiedAt])
	);

	log(`sales: ${n.toLocaleString('en')}`);
	await copyInto(sql, 'sales', ['id', 'client_id', 'cultivar_id', 'market_day_id', 'sold_on', 'quantity', 'price_per_plant_cents', 'buyer_email'], n, (i) => {
		const p = plantFacts(ctx, i);
		const uuid = `00000000-0000-4000-8000-${p.saleId.toString(16).padStart(12, '0')}`;
		return copyLine([p.saleId, uuid, ctx.cultivarIds[p.cultivar], p.marketDayId, formatIsoDate(p.soldOn), 1, 1800, null]);
	});

	log(`plants: ${n.toLocaleString('en')}`);
	await copyInto(
		sql,
		'plants',
		['id', 'sale_id', 'cultivar_id', 'sold_on', 'age_at_sale_weeks', 'gardener_id', 'claimed_at', 'planted_on', 'age_at_planting_weeks', 'stage', 'next_step_on', 'next_step_kind', 'last_milestone_on', 'last_milestone_kind'],
		n,
		(i) => {
			const p = plantFacts(ctx, i);
			const s = planSummary(ctx, p);
			const claimed = p.gardenerId !== null;
			return copyLine([
				p.id,
				p.saleId,
				ctx.cultivarIds[p.cultivar],
				formatIsoDate(p.soldOn),
				AGES_AT_SALE[p.ageIndex],
				p.gardenerId,
				claimed ? formatIsoDate(p.soldOn) + 'T12:00:00Z' : null,
				p.plantedOn === null ? null : formatIsoDate(p.plantedOn),
				claimed ? AGES_AT_SALE[p.ageIndex] : null,
				s.stage,
				s.nextOn,
				s.nextKind,
				s.lastOn,
				s.lastKind
			]);
		}
	);

	// Steps: one COPY row per step of every claimed plant's plan.
	let steps = 0;
	if (!withSteps) {
		for (const table of ['users', 'sales', 'plants']) await syncIdentity(sql, table);
		return { plants: n, steps };
	}
	log('plan steps…');
	const stepColumns = ['plant_id', 'generation', 'kind', 'occurrence', 'title', 'earliest', 'likely', 'latest', 'amount', 'guide'];
	const writable = await sql.unsafe(`copy plan_steps (${stepColumns.join(', ')}) from stdin`).writable();
	await pipeline(
		Readable.from(
			(function* () {
				let chunk = '';
				let rows = 0;
				for (let i = 0; i < n; i++) {
					const p = plantFacts(ctx, i);
					if (p.plantedOn === null) continue;
					for (const s of ctx.templates[p.cultivar][p.ageIndex]) {
						chunk += copyLine([p.id, s.generation, s.kind, s.occurrence, s.title, formatIsoDate(p.plantedOn + s.earliest), formatIsoDate(p.plantedOn + s.likely), formatIsoDate(p.plantedOn + s.latest), s.amount, s.guide]);
						rows++;
					}
					if (rows >= BATCH_ROWS) {
						steps += rows;
						yield chunk;
						chunk = '';
						rows = 0;
					}
					if (i > 0 && i % 100_000 === 0) log(`  … ${i.toLocaleString('en')} plants, ${steps.toLocaleString('en')} steps`);
				}
				steps += rows;
				if (chunk) yield chunk;
			})()
		),
		writable
	);
	for (const table of ['users', 'sales', 'plants']) await syncIdentity(sql, table);
	return { plants: n, steps };
}
