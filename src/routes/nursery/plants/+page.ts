import type { PlantTablePage } from '$lib/plant-table';
import { plantTableSearch, queryObject } from '$lib/schema/plant-table';
import type { PageLoad } from './$types';

export interface TableError {
	message: string;
	issues: { path: (string | number)[]; message: string }[];
}

/**
 * The rows, from the same JSON API anyone can call: rendered on the server on first load, then
 * fetched by the browser on every filter, sort or page change (the URL holds the view).
 */
export const load: PageLoad = async ({ data, fetch, url }) => {
	const values = queryObject(url.searchParams);
	const search = plantTableSearch(values);
	let result: PlantTablePage | null = null;
	let error: TableError | null = null;
	try {
		const res = await fetch(`/api/v1/plants${search}`, { headers: { accept: 'application/json' } });
		const body = await res.json().catch(() => null);
		if (res.ok) result = body as PlantTablePage;
		else error = body?.error ?? { message: `The plants could not be loaded (${res.status})`, issues: [] };
	} catch {
		error = { message: 'The plants could not be loaded: check the connection and try again', issues: [] };
	}
	return { ...data, values, search, result, error };
};
