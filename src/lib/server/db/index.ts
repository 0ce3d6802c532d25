import { drizzle } from 'drizzle-orm/postgres-js';
import postgres from 'postgres';
import { config } from '../config';
import * as schema from './schema';

const client = postgres(config.databaseUrl, { max: 10, onnotice: () => {} });
export const db = drizzle(client, { schema });
export type Db = typeof db;
export { schema };

/** Ends the pool once running queries finish (at most `timeoutS` seconds), so the process can exit. */
export const closeDb = (timeoutS = 5) => client.end({ timeout: timeoutS });
