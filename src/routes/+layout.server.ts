import type { LayoutServerLoad } from './$types';

// Public: the shell only needs to know who is signed in, to draw the right navigation.
export const load: LayoutServerLoad = ({ locals }) => ({
	user: locals.user ? { name: locals.user.name, role: locals.user.role, email: locals.user.email } : null
});
