import { eq } from 'drizzle-orm';
import { db } from '../db';
import { nurserySettings } from '../db/schema';

const FALLBACK = { name: 'Your nursery', town: 'your town', market: 'the market' };

export const nurseryService = {
	async settings() {
		return (await db.select().from(nurserySettings).where(eq(nurserySettings.id, 1)))[0];
	},
	async publicProfile() {
		const s = await this.settings();
		return s ? { name: s.name, town: s.town, market: s.market } : FALLBACK;
	}
};
