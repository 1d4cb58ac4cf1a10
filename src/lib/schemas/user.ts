import { z } from 'zod';
import { ROLES } from '../roles';

export const PASSWORD_MIN_LENGTH = 12;

export const emailField = z
	.string()
	.trim()
	.toLowerCase()
	.pipe(z.email({ error: 'Enter an e-mail address such as name@example.org.' }));

export const passwordField = z
	.string()
	.min(PASSWORD_MIN_LENGTH, { error: `Use at least ${PASSWORD_MIN_LENGTH} characters.` })
	.max(200, { error: 'Use at most 200 characters.' });

export const signInSchema = z.object({
	email: emailField,
	password: passwordField,
	// Only same-site paths: "//host" or "/\host" would leave the site.
	redirectTo: z
		.string()
		.regex(/^\/(?![/\\])/)
		.optional()
});

const rolesField = z.array(z.enum(ROLES)).min(1, { error: 'Give the account at least one role.' });

export const invitationSchema = z.object({
	email: emailField,
	name: z.string().trim().min(1, { error: 'Enter the person’s name.' }).max(120),
	roles: rolesField,
	teamIds: z.array(z.string().min(1)).min(1, { error: 'Put the account in at least one team.' })
});

const userIdField = z.string().min(1, { error: 'No account given.' });

export const roleAssignmentSchema = z.object({ userId: userIdField, roles: rolesField });

/** Deactivating, reactivating, or sending a new one-time link: the account is all it takes. */
export const accountActionSchema = z.object({ userId: userIdField });

export const setPasswordSchema = z
	.object({ password: passwordField, confirm: z.string() })
	.refine((v) => v.password === v.confirm, {
		path: ['confirm'],
		error: 'The two passwords differ.'
	});

export type SignIn = z.infer<typeof signInSchema>;
export type Invitation = z.infer<typeof invitationSchema>;

/** What the people page says after an account change, with the one-time link when there is one. */
export type AdminNote = { text: string; link?: string; email?: string };
