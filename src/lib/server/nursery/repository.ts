import { eq } from 'drizzle-orm';
import { db } from '../db';
import { nurserySettings } from '../db/schema';

export const nurseryRepository = {
	settings: async () => (await db.select().from(nurserySettings).where(eq(nurserySettings.id, 1)))[0]
};
