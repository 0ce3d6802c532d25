import { z } from 'zod';

const pageSchema = z.object({
	page: z.coerce.number().int().min(1).max(100_000).catch(1),
	size: z.coerce.number().int().min(5).max(100).catch(25)
});

/** Page and page size from the query string; bad values fall back to the first page. */
export function pageQuery(url: URL): { page: number; size: number } {
	return pageSchema.parse({ page: url.searchParams.get('page') ?? undefined, size: url.searchParams.get('size') ?? undefined });
}
