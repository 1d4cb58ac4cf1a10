import { env } from '$env/dynamic/private';
import { getDb } from '../db';
import { storedSecret } from '../settings';

let secret: string | undefined;

/** The secret session tokens are encrypted under; fixed for the life of the process. */
export function authSecret(): string {
	secret ??= env.AUTH_SECRET || storedSecret(getDb(), 'auth-secret');
	return secret;
}
