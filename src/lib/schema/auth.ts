import { z } from 'zod';
import { CONTROL_CHARACTERS, idField, lineField } from './fields';

/** The one list of roles: the pg enum, the schemas, the guard and the pages derive from it. */
export const ROLES = ['owner', 'staff', 'gardener'] as const;
export type Role = (typeof ROLES)[number];
/** The nursery's own people; gardeners are its buyers. */
export const TEAM_ROLES = ['owner', 'staff'] as const satisfies readonly Role[];
export type TeamRole = (typeof TEAM_ROLES)[number];

/** How a role reads on a page and in e-mail. */
export const ROLE_LABELS: Record<Role, string> = { owner: 'Owner', staff: 'Staff', gardener: 'Gardener' };
/** The same inside a sentence ("invited as staff"). */
export const roleInSentence = (role: Role) => ROLE_LABELS[role].toLowerCase();

const roleList = (roles: readonly Role[]) => roles.map(roleInSentence).join(' or ');

export const PASSWORD_MIN = 8;
export const PASSWORD_MAX = 128;

export const emailField = z
	.string({ error: 'Enter an e-mail address' })
	.trim()
	.toLowerCase()
	.min(1, 'Enter an e-mail address')
	.max(254, 'An e-mail address has at most 254 characters')
	.pipe(z.email('Enter an e-mail address like name@example.com'));

export const newPasswordField = z
	.string({ error: 'Choose a password' })
	.min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
	.max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`)
	.refine((p) => !CONTROL_CHARACTERS.test(p), 'A password cannot hold control characters such as tabs or line breaks');
// How guessable it is (common passwords, the person's name and e-mail, the nursery's name) is judged
// by $lib/password-strength, in the browser as a hint and on the server as the refusal.

export const NAME_MAX = 80;
export const nameField = lineField({ required: 'Enter your name', max: NAME_MAX, tooLong: `A name has at most ${NAME_MAX} characters`, bidi: true });

export const signUpSchema = z.object({ name: nameField, email: emailField, password: newPasswordField });

const currentPasswordField = z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(PASSWORD_MAX, 'Too long');

export const signInSchema = z.object({ email: emailField, password: currentPasswordField });

export const changePasswordSchema = z.object({ currentPassword: currentPasswordField, password: newPasswordField });

export const resetRequestSchema = z.object({ email: emailField });

export const tokenField = z
	.string({ error: 'This link is incomplete' })
	.regex(/^[a-z2-7]{32}$/, 'This link is not valid: request a new one');

export const verifySchema = z.object({ token: tokenField });

export const resetSchema = z.object({ token: tokenField, password: newPasswordField });

export const inviteSchema = z.object({ email: emailField, role: z.enum(TEAM_ROLES, { error: `Choose ${roleList(TEAM_ROLES)}` }) });

export const acceptInviteSchema = z.object({ token: tokenField, name: nameField, password: newPasswordField });

export const changeRoleSchema = z.object({
	userId: idField('Unknown person'),
	role: z.enum(ROLES, { error: `Choose ${roleList(ROLES)}` }),
	/** Present once the owner has confirmed the change on the page. */
	confirmed: z.literal('yes').optional()
});
