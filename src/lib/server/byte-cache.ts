/**
 * A memory cache of computed text (calendars) bounded by its total size: the least recently used
 * entries go first once the cap is reached. Each app instance keeps its own; that is enough for
 * values that are a pure function of their key.
 */
import { LRUCache } from 'lru-cache';

export function byteCache(maxBytes: number) {
	const cache = new LRUCache<string, string>({ maxSize: maxBytes, sizeCalculation: (value, key) => Buffer.byteLength(value) + Buffer.byteLength(key) });
	const stats = { hits: 0, misses: 0 };
	return {
		stats,
		/** The stored value for the key, or the computed one, stored for next time. */
		through(key: string, compute: () => string): string {
			const hit = cache.get(key);
			if (hit !== undefined) {
				stats.hits++;
				return hit;
			}
			stats.misses++;
			const value = compute();
			cache.set(key, value);
			return value;
		},
		get size() {
			return cache.calculatedSize;
		}
	};
}
