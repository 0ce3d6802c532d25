/**
 * The stall's type-ahead: which batches match the letters typed, best first. Pure, so the phone
 * screen and its tests agree. Batches loaded for today's market come before the nursery's; a
 * name that starts with the letters before one that only contains them.
 */
export interface StallBatch {
	id: number;
	cultivar: { slug: string; name: string };
	pottedOn: string;
	ageWeeks: number;
	onHand: number;
	location: null | { marketDayId: number; on: string; place: string };
	usualPriceCents: number | null;
}

const fold = (s: string) => s.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase();

export function matchBatches<B extends StallBatch>(batches: readonly B[], query: string, limit = 8): B[] {
	const q = fold(query.trim());
	const rank = (b: B): number => {
		const name = fold(b.cultivar.name);
		const words = name.split(/[\s-]+/);
		if (q === '') return 0;
		if (name.startsWith(q)) return 0;
		if (words.some((w) => w.startsWith(q))) return 1;
		if (name.includes(q) || fold(b.cultivar.slug).includes(q)) return 2;
		return -1;
	};
	return batches
		.map((b, i) => ({ b, i, r: rank(b) }))
		.filter((x) => x.r >= 0 && x.b.onHand > 0)
		.sort((x, y) => Number(x.b.location === null) - Number(y.b.location === null) || x.r - y.r || x.i - y.i)
		.slice(0, limit)
		.map((x) => x.b);
}
