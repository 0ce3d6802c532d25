import { json } from '@sveltejs/kit';
import { catalogue } from '$lib/server/plan-preview';
import type { RequestHandler } from './$types';

// Public: the cultivar catalogue is the nursery's published reference, needed before anyone signs in.
export const GET: RequestHandler = () => json({ cultivars: catalogue.cultivars }, { headers: { 'cache-control': 'public, max-age=3600' } });
