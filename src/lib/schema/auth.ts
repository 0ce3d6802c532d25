import { z } from 'zod';

export const ROLES = ['owner', 'staff', 'gardener'] as const;
export type Role = (typeof ROLES)[number];

/** Refused outright: the most common choices in public breach lists (NCSC "100k most common", top entries). */
export const COMMON_PASSWORDS = new Set([
	'password', 'password1', 'password123', '12345678', '123456789', '1234567890', 'qwertyuiop',
	'qwerty123', 'iloveyou', '11111111', '00000000', 'abc12345', 'sunshine', 'princess', 'football',
	'baseball', 'welcome1', 'letmein1', 'passw0rd', 'trustno1', 'superman', 'starwars', 'whatever',
	'dragon12', 'monkey12', 'bananas1', 'banana123', 'bunchline'
]);

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
	.refine((p) => !COMMON_PASSWORDS.has(p.toLowerCase()), 'This password is too common: choose another');

export const nameField = z
	.string({ error: 'Enter your name' })
	.trim()
	.min(1, 'Enter your name')
	.max(80, 'A name has at most 80 characters');

export const signUpSchema = z.object({ name: nameField, email: emailField, password: newPasswordField });

export const signInSchema = z.object({
	email: emailField,
	password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(PASSWORD_MAX, 'Too long')
});

export const resetRequestSchema = z.object({ email: emailField });

export const tokenField = z
	.string({ error: 'This link is incomplete' })
	.regex(/^[a-z2-7]{32}$/, 'This link is not valid: request a new one');

export const verifySchema = z.object({ token: tokenField });

export const resetSchema = z.object({ token: tokenField, password: newPasswordField });

export const inviteSchema = z.object({ email: emailField, role: z.enum(['staff', 'owner'], { error: 'Choose staff or owner' }) });

export const acceptInviteSchema = z.object({ token: tokenField, name: nameField, password: newPasswordField });

export const changeRoleSchema = z.object({
	userId: z.coerce.number({ error: 'Unknown person' }).int().positive('Unknown person'),
	role: z.enum(ROLES, { error: 'Choose owner, staff or gardener' })
});
