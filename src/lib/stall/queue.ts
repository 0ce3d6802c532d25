/**
 * Sales recorded while the market has no signal: kept in the browser (localStorage) with the
 * client-generated id, and sent in order when the connection returns. The server stores a sale
 * once per client id, so a sale sent twice (the answer lost on the way back) is still one sale.
 */
export interface QueuedSale {
	clientId: string;
	batchId: number;
	quantity: number;
	pricePerPlant: number;
	buyerEmail?: string;
	/** For the waiting list on screen. */
	label: string;
	queuedAt: string;
}

export interface KeyValueStore {
	getItem(key: string): string | null;
	setItem(key: string, value: string): void;
}

export const QUEUE_KEY = 'bunchline.stall.queue';

export function readQueue(store: KeyValueStore): QueuedSale[] {
	try {
		const parsed = JSON.parse(store.getItem(QUEUE_KEY) ?? '[]');
		return Array.isArray(parsed) ? parsed : [];
	} catch {
		return [];
	}
}

export const writeQueue = (store: KeyValueStore, queue: QueuedSale[]) => store.setItem(QUEUE_KEY, JSON.stringify(queue));

export type SendOutcome = { kind: 'stored'; body: unknown } | { kind: 'refused'; message: string } | { kind: 'offline' };

/**
 * Sends what waits, oldest first. A stored or refused sale leaves the queue (a refusal will not
 * change by resending it); a failed connection stops the run and keeps the rest for later.
 */
export async function flushQueue(
	store: KeyValueStore,
	send: (sale: QueuedSale) => Promise<SendOutcome>,
	report: (sale: QueuedSale, outcome: SendOutcome) => void
): Promise<number> {
	let sent = 0;
	for (;;) {
		const [next] = readQueue(store);
		if (!next) return sent;
		const outcome = await send(next);
		if (outcome.kind === 'offline') return sent;
		writeQueue(
			store,
			readQueue(store).filter((s) => s.clientId !== next.clientId)
		);
		report(next, outcome);
		sent++;
	}
}

/** One POST of a queued sale: a network failure is "offline", a 4xx a refusal to show. */
export async function postSale(sale: QueuedSale, fetcher: typeof fetch = fetch): Promise<SendOutcome> {
	const { label: _label, queuedAt: _queuedAt, ...body } = sale;
	let res: Response;
	try {
		res = await fetcher('/api/v1/sales', { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify(body) });
	} catch {
		return { kind: 'offline' };
	}
	const json = await res.json().catch(() => null);
	if (res.ok) return { kind: 'stored', body: json };
	// A server that is down or overloaded is like no signal: try again later.
	if (res.status >= 500 || res.status === 429) return { kind: 'offline' };
	const message = (json as { error?: { message?: string; issues?: { message: string }[] } } | null)?.error;
	return { kind: 'refused', message: message?.issues?.[0]?.message ?? message?.message ?? `Refused (${res.status})` };
}
