import type { Role } from './schema/auth';

export interface NavLink {
	href: string;
	label: string;
}

const publicLinks: NavLink[] = [
	{ href: '/planner', label: 'Year planner' },
	{ href: '/guides', label: 'Guides' }
];

const byRole: Record<Role, NavLink[]> = {
	gardener: [{ href: '/plants', label: 'My plants' }],
	staff: [{ href: '/nursery/stall', label: 'Stall' }],
	owner: [
		{ href: '/nursery', label: 'Dashboard' },
		{ href: '/nursery/stall', label: 'Stall' },
		{ href: '/nursery/team', label: 'Team' }
	]
};

export function navFor(role: Role | null): NavLink[] {
	return role ? [...byRole[role], ...publicLinks] : publicLinks;
}

/** Where each role lands after signing in. */
export const HOME_FOR: Record<Role, string> = { gardener: '/plants', staff: '/nursery/stall', owner: '/nursery' };

/** Only same-site paths are followed after sign-in (no open redirect). */
export function safeNext(next: string | null, fallback: string): string {
	return next && next.startsWith('/') && !next.startsWith('//') && !next.startsWith('/\\') ? next : fallback;
}
