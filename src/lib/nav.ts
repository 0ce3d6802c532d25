import type { Role } from './schema/auth';

export interface NavLink {
	href: string;
	label: string;
}

const publicLinks: NavLink[] = [
	{ href: '/cultivars', label: 'Cultivars' },
	{ href: '/planner', label: 'Year planner' },
	{ href: '/guides', label: 'Guides' },
	{ href: '/questions', label: 'Questions' },
	{ href: '/search', label: 'Search' }
];

const byRole: Record<Role, NavLink[]> = {
	gardener: [
		{ href: '/plants', label: 'My plants' },
		{ href: '/ask', label: 'Ask the nursery' },
		{ href: '/settings', label: 'Settings' }
	],
	staff: [
		{ href: '/nursery/stall', label: 'Stall' },
		{ href: '/nursery/stock', label: 'Stock' },
		{ href: '/nursery/plants', label: 'Plants sold' },
		{ href: '/nursery/reminders', label: 'Reminders' },
		{ href: '/nursery/questions', label: 'Question queue' },
		{ href: '/nursery/guides', label: 'Nursery guides' }
	],
	owner: [
		{ href: '/nursery', label: 'Dashboard' },
		{ href: '/nursery/stall', label: 'Stall' },
		{ href: '/nursery/stock', label: 'Stock' },
		{ href: '/nursery/plants', label: 'Plants sold' },
		{ href: '/nursery/team', label: 'Team' },
		{ href: '/nursery/reminders', label: 'Reminders' },
		{ href: '/nursery/questions', label: 'Question queue' },
		{ href: '/nursery/guides', label: 'Nursery guides' }
	]
};

/** Every signed-in person's own settings. */
const accountLink: NavLink = { href: '/settings/account', label: 'Account' };

export interface NavGroups {
	/** The role's own work: the second row of the header on a wide screen. */
	work: NavLink[];
	/** The public site, the same for everyone. */
	site: NavLink[];
	/** The signed-in person's account settings, beside "Sign out". */
	account: NavLink | null;
}

export function navFor(role: Role | null): NavGroups {
	return { work: role ? byRole[role] : [], site: publicLinks, account: role ? accountLink : null };
}

/** Where each role lands after signing in. */
export const HOME_FOR: Record<Role, string> = { gardener: '/plants', staff: '/nursery/stall', owner: '/nursery' };

const PROBE_ORIGIN = 'http://same-site.invalid';

/** The path with every percent-encoding undone (a few rounds: proxies and frameworks may decode again), or null if malformed. */
function fullyDecoded(path: string): string | null {
	let current = path;
	for (let round = 0; round < 4; round++) {
		let next: string;
		try {
			next = decodeURIComponent(current);
		} catch {
			return null;
		}
		if (next === current) return current;
		current = next;
	}
	return null;
}

/** "//host" and "/\\host" are network paths to another site, for browsers and for some servers' decoding. */
function leavesSite(path: string): boolean {
	const networkPath = /^[/\\][/\\]/;
	const resolved = new URL(path, PROBE_ORIGIN);
	return networkPath.test(path) || resolved.origin !== PROBE_ORIGIN || networkPath.test(resolved.pathname);
}

/**
 * Only same-site paths are followed after sign-in (no open redirect, ASVS 3.7.2). The value is
 * resolved against the site the way a browser would (dot segments, "\\" read as "/"), and kept
 * only if the result stays on the site and its path, decoded as often as anyone might decode it,
 * neither starts with "//" or "/\\" nor points elsewhere. Control characters are refused outright:
 * they are not valid in a Location header either.
 */
export function safeNext(next: string | null, fallback: string): string {
	if (!next || !next.startsWith('/') || /[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
	try {
		const url = new URL(next, PROBE_ORIGIN);
		if (url.origin !== PROBE_ORIGIN) return fallback;
		const decoded = fullyDecoded(url.pathname);
		if (decoded === null || /[\u0000-\u001f\u007f\\]/.test(decoded) || leavesSite(url.pathname) || leavesSite(decoded)) return fallback;
		return url.pathname + url.search + url.hash;
	} catch {
		return fallback;
	}
}
