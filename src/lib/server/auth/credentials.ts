import type { SignIn } from '../../schemas/user';
import type { Db } from '../db/open';
import { findUserByEmail } from '../users';
import { verifyPassword } from './password';
import {
	recordFailedSignIn,
	recordSuccessfulSignIn,
	retryAfterSeconds,
	throttleKeys
} from './throttle';

export type SignInRefusal = 'credentials' | 'throttled' | 'deactivated';
export type CredentialCheck =
	| { ok: true; user: { id: string; email: string; name: string; sessionVersion: number } }
	| { ok: false; reason: SignInRefusal; retryAfter_s?: number };

/**
 * Checks an e-mail and password for a sign-in from `clientAddress`. Unknown accounts and wrong
 * passwords give the same answer after the same work; only someone who knows the password
 * learns that the account is deactivated.
 */
export async function checkCredentials(
	db: Db,
	{ email, password }: Pick<SignIn, 'email' | 'password'>,
	clientAddress: string
): Promise<CredentialCheck> {
	const keys = throttleKeys(email, clientAddress);
	const wait = retryAfterSeconds(db, keys);
	if (wait > 0) return { ok: false, reason: 'throttled', retryAfter_s: wait };

	const found = findUserByEmail(db, email);
	const matches = await verifyPassword(found?.passwordHash, password);
	if (!found || !matches) {
		recordFailedSignIn(db, keys);
		return { ok: false, reason: 'credentials' };
	}
	if (!found.active) return { ok: false, reason: 'deactivated' };
	recordSuccessfulSignIn(db, keys);
	return {
		ok: true,
		user: {
			id: found.id,
			email: found.email,
			name: found.name ?? found.email,
			sessionVersion: found.sessionVersion
		}
	};
}

export const SIGN_IN_MESSAGES: Record<SignInRefusal, string> = {
	credentials: 'That e-mail and password do not match an account.',
	throttled: 'Too many failed sign-ins. Wait a moment, then try again.',
	deactivated: 'This account has been deactivated. Ask an administrator to restore it.'
};
