import { error, redirect } from '@sveltejs/kit';
import { roleInSentence, TEAM_ROLES, type Role } from '../../schema/auth';

export type AuthUser = NonNullable<App.Locals['user']>;

interface GuardEvent {
	locals: App.Locals;
	url: URL;
}

/**
 * The one authorisation check. Every protected load, action and endpoint calls it;
 * tests/unit/guard-coverage.test.ts fails when one does not.
 * Signed out: pages redirect to sign-in, endpoints answer 401. Wrong role: 403.
 */
export function requireUser(event: GuardEvent, ...roles: Role[]): AuthUser {
	const user = event.locals.user;
	if (!user) {
		if (event.url.pathname.startsWith('/api/') || event.url.pathname.startsWith('/feeds/')) {
			error(401, 'Sign in first');
		}
		redirect(303, `/login?next=${encodeURIComponent(event.url.pathname + event.url.search)}`);
	}
	if (roles.length > 0 && !roles.includes(user.role)) {
		error(403, refusalFor(roles));
	}
	return user;
}

/** Says who the page is for, so a refused person knows whom to ask. */
export function refusalFor(roles: readonly Role[]): string {
	if (roles.length === TEAM_ROLES.length && TEAM_ROLES.every((r) => roles.includes(r))) return 'This page is for the nursery team only';
	if (roles.length === 1 && roles[0] === 'owner') return "This page is for the nursery's owner only";
	return `This page is for ${roles.map((r) => roleInSentence(r)).join(' and ')} accounts only`;
}

export const STAFF_ROLES: Role[] = [...TEAM_ROLES];
