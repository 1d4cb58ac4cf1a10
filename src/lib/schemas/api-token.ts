import { z } from 'zod';

/**
 * What a personal API token may do. A token acts as its owner, so each scope only narrows what
 * the owner could do by hand; it never widens it.
 */
export const API_TOKEN_SCOPES = ['readings:write', 'readings:read', 'campaigns:read'] as const;
export type ApiTokenScope = (typeof API_TOKEN_SCOPES)[number];

/** Where a token stands; only an active one signs requests. */
export type ApiTokenState = 'active' | 'expired' | 'revoked';

export const API_TOKEN_SCOPE_LABELS: Record<ApiTokenScope, string> = {
	'readings:write': 'Send readings',
	'readings:read': 'Read readings and coverage',
	'campaigns:read': 'Read campaigns, revisions and matrices'
};

/** Longest a token may live; one without an expiry lives until revoked. */
export const API_TOKEN_MAX_LIFETIME_DAYS = 366;

/** One schema for the Account page's form and `POST /api/v1/tokens`. */
export const apiTokenSchema = z.object({
	name: z
		.string()
		.trim()
		.min(1, { error: 'Name the token, e.g. after the computer that uses it.' })
		.max(80),
	scopes: z
		.array(z.enum(API_TOKEN_SCOPES))
		.min(1, { error: 'Give the token at least one scope.' })
		.max(API_TOKEN_SCOPES.length),
	expiresAt: z.coerce
		.date({ error: 'Give a date, or leave it empty for no expiry.' })
		.optional()
		.nullable()
});

export type ApiTokenInput = z.infer<typeof apiTokenSchema>;
