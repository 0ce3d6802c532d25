/**
 * Calendar feeds a gardener subscribes to: one plant, or all their plants, at /feeds/<token>.ics.
 * Tokens carry 160 random bits and only their hash is stored; a revoked, unknown or foreign token
 * is simply not found. Calendar bytes are rendered once per plan change and stored with their ETag;
 * polls are answered from the stored bytes (and a per-process copy), or with 304.
 */
import { createHash } from 'node:crypto';
import { hashToken, newToken } from '../auth';
import { storedCalendar, type StoredStep } from '../calendar';
import { config } from '../config';
import { UserFacingError } from '../errors';
import { httpDate, notModified } from '../../http-cache';
import { feedRepository, type FeedRepository } from './repository';

/** Tokens from newToken(): 32 base32 characters. Anything else is refused before any query. */
const TOKEN_SHAPE = /^[a-z2-7]{32}$/;
/** What a feed with no plant shows as its last change. */
const EPOCH = new Date(0);

export const plantLabel = (cultivar: string, plantId: number) => `${cultivar} #${plantId}`;

export function feedUrls(origin: string, token: string) {
	const https = new URL(`/feeds/${token}.ics`, origin).toString();
	return { https, webcal: https.replace(/^https?:/, 'webcal:') };
}

export interface FeedAnswer {
	status: 200 | 304 | 404;
	body?: string;
	headers: Record<string, string>;
}

interface Rendered {
	etag: string;
	lastModified: Date;
	ics: string;
}

export function createFeedService(repo: FeedRepository, origin: () => string, clock: () => Date = () => new Date()) {
	/** feed id → the bytes last served, so a hot feed is not read from the database on every poll. */
	const memory = new Map<number, Rendered>();
	const MEMORY_LIMIT = 2000;

	function remember(id: number, r: Rendered) {
		if (memory.size >= MEMORY_LIMIT) memory.delete(memory.keys().next().value!);
		memory.set(id, r);
	}

	async function render(feed: { id: number; userId: number; plantId: number | null }, version: string): Promise<Rendered> {
		const rows = await repo.steps(feed);
		const steps: StoredStep[] = rows.map((r) => ({ ...r, plantLabel: plantLabel(r.cultivar, r.plantId) }));
		const name = feed.plantId === null ? 'My banana plants · Bunchline' : `${rows[0] ? plantLabel(rows[0].cultivar, feed.plantId) : 'Banana plant'} · Bunchline`;
		const ics = storedCalendar(steps, { name, origin: origin(), labelPlants: feed.plantId === null });
		const lastModified = steps.reduce((latest, s) => (s.changedAt > latest ? s.changedAt : latest), EPOCH);
		const etag = `"${createHash('sha256').update(ics).digest('base64url').slice(0, 27)}"`;
		const rendered = { ics, etag, lastModified };
		await repo.storeRendered(feed.id, { ...rendered, renderedVersion: version });
		return rendered;
	}

	return {
		/** Issues a feed; the URL (with its token) is shown this once. */
		async create(userId: number, plantId: number | undefined) {
			if (plantId !== undefined && !(await repo.plantOwnedBy(plantId, userId))) throw new UserFacingError('plantId', 'No such plant among yours', 404);
			const token = newToken();
			const id = await repo.insert({ userId, plantId: plantId ?? null, tokenHash: hashToken(token) });
			return { id, ...feedUrls(origin(), token) };
		},

		async plantChoices(userId: number) {
			return (await repo.plantsOf(userId)).map((p) => ({ id: p.id, label: plantLabel(p.cultivar, p.id) }));
		},

		async list(userId: number) {
			const rows = await repo.list(userId);
			return rows.map((r) => ({
				id: r.id,
				plantId: r.plantId,
				scope: r.plantId === null ? 'All my plants' : plantLabel(r.cultivar ?? 'Plant', r.plantId),
				createdAt: r.createdAt.toISOString()
			}));
		},

		async revoke(userId: number, id: number) {
			if (!(await repo.revoke(id, userId, clock()))) throw new UserFacingError('id', 'No such feed among yours', 404);
			memory.delete(id);
		},

		/** A new URL for the same calendar; the old one stops working at once. */
		async rotate(userId: number, id: number) {
			const token = newToken();
			const newId = await repo.rotate(id, userId, hashToken(token), clock());
			if (newId === null) throw new UserFacingError('id', 'No such feed among yours', 404);
			memory.delete(id);
			return { id: newId, ...feedUrls(origin(), token) };
		},

		/** The answer to a calendar app's poll. */
		async fetch(token: string, ifNoneMatch: string | null, ifModifiedSince: string | null): Promise<FeedAnswer> {
			const notFound: FeedAnswer = { status: 404, headers: { 'cache-control': 'private, no-store' } };
			if (!TOKEN_SHAPE.test(token)) return notFound;
			const feed = await repo.lookup(hashToken(token));
			if (!feed || feed.version === null) return notFound;
			let current: Rendered | undefined;
			if (feed.renderedVersion === feed.version && feed.etag && feed.lastModified) {
				const held = memory.get(feed.id);
				current = held?.etag === feed.etag ? held : undefined;
				if (!current && notModified(ifNoneMatch, ifModifiedSince, { etag: feed.etag, lastModified: feed.lastModified })) {
					return { status: 304, headers: validatorHeaders(feed.etag, feed.lastModified) };
				}
				if (!current) {
					const ics = await repo.storedIcs(feed.id);
					if (ics !== null) current = { ics, etag: feed.etag, lastModified: feed.lastModified };
				}
			}
			current ??= await render(feed, feed.version);
			remember(feed.id, current);
			const headers = validatorHeaders(current.etag, current.lastModified);
			if (notModified(ifNoneMatch, ifModifiedSince, current)) return { status: 304, headers };
			return { status: 200, body: current.ics, headers: { ...headers, 'content-type': 'text/calendar; charset=utf-8' } };
		},

		invalidatePlant: (plantId: number) => repo.invalidateForPlant(plantId)
	};
}

function validatorHeaders(etag: string, lastModified: Date): Record<string, string> {
	// private: the URL is a secret of one gardener; no-cache: keep a copy, but ask (cheaply, with 304) before using it.
	return { etag, 'last-modified': httpDate(lastModified), 'cache-control': 'private, no-cache' };
}

export type FeedService = ReturnType<typeof createFeedService>;

export const feeds = createFeedService(feedRepository, () => config.publicUrl);
