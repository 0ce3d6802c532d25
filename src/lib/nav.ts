import type { Role } from './schema/auth';

export interface NavLink {
	href: string;
	label: string;
}

const publicLinks: NavLink[] = [
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
		{ href: '/nursery/plants', label: 'Plants sold' },
		{ href: '/nursery/reminders', label: 'Reminders' },
		{ href: '/nursery/questions', label: 'Question queue' },
		{ href: '/nursery/guides', label: 'Nursery guides' }
	],
	owner: [
		{ href: '/nursery', label: 'Dashboard' },
		{ href: '/nursery/stall', label: 'Stall' },
		{ href: '/nursery/plants', label: 'Plants sold' },
		{ href: '/nursery/team', label: 'Team' },
		{ href: '/nursery/reminders', label: 'Reminders' },
		{ href: '/nursery/questions', label: 'Question queue' },
		{ href: '/nursery/guides', label: 'Nursery guides' }
	]
};

export function navFor(role: Role | null): NavLink[] {
	return role ? [...byRole[role], ...publicLinks] : publicLinks;
}

/** Where each role lands after signing in. */
export const HOME_FOR: Record<Role, string> = { gardener: '/plants', staff: '/nursery/stall', owner: '/nursery' };

const PROBE_ORIGIN = 'http://same-site.invalid';

/**
 * Only same-site paths are followed after sign-in (no open redirect). The path is resolved the
 * way a browser would — which drops tabs and newlines and reads "\\" as "/" — and kept only if
 * it stays on this site; control characters are refused outright, since they are not valid in
 * a Location header either.
 */
export function safeNext(next: string | null, fallback: string): string {
	if (!next || !next.startsWith('/') || /[\u0000-\u001f\u007f\\]/.test(next)) return fallback;
	try {
		const url = new URL(next, PROBE_ORIGIN);
		return url.origin === PROBE_ORIGIN ? url.pathname + url.search + url.hash : fallback;
	} catch {
		return fallback;
	}
}
