/** Everything the server reads from its environment: parsed once, by the rules the scripts share (env.js). */
import { parseEnvironment, MODES } from './env.js';

export type Mode = (typeof MODES)[number];

const env = parseEnvironment(process.env, { viteDev: Boolean(import.meta.env?.DEV) });

export const config = {
	...env,
	/** Production and any https site: Secure cookies with the __Host- prefix. */
	secureCookies: env.mode === 'production' || env.publicUrl.startsWith('https:'),
	/** The captured mail is only readable outside production. */
	devMailbox: env.mode !== 'production',
	/**
	 * Key of the claim codes printed on care cards (HMAC of the plant's id and claim version), at
	 * least 32 characters. Required in production; demo and tests generate one and keep it in the
	 * database (src/lib/server/secrets.ts), so every process on that database agrees.
	 */
	claimSecret: env.claimSecret
};

/** In production, e-mailed links and the origin check need the public URL. */
export function assertReadyToServe(c: Pick<typeof config, 'mode' | 'originGiven'> = config): void {
	if (c.mode === 'production' && !c.originGiven) {
		throw new Error('Set ORIGIN to the public URL of this site (for example ORIGIN=https://plants.example.org)');
	}
}
