import { CredentialsSignin } from '@auth/sveltekit';
import { isRedirect, type RequestEvent } from '@sveltejs/kit';
import type { SignIn } from '../../schemas/user';
import type { SignInRefusal } from './credentials';
import { retryAfterSeconds, throttleKeys } from './throttle';
import { signIn } from './index';

export type SignInResult =
	{ ok: true } | { ok: false; reason: SignInRefusal; retryAfter_s: number };

const REFUSALS: readonly SignInRefusal[] = ['credentials', 'throttled', 'deactivated'];

/** Runs Auth.js's credentials sign-in for a form that our own action has already validated. */
export async function signInWithPassword(
	event: RequestEvent,
	{ email, password }: Pick<SignIn, 'email' | 'password'>
): Promise<SignInResult> {
	const body = new FormData();
	body.set('providerId', 'credentials');
	body.set('email', email);
	body.set('password', password);
	body.set('redirectTo', '/');
	const headers = new Headers(event.request.headers);
	headers.delete('content-type');
	headers.delete('content-length');
	const request = new Request(event.url, { method: 'POST', headers, body });
	try {
		await signIn({ ...event, request });
	} catch (thrown) {
		// Success ends in a redirect (the session cookie is set by then); a refusal is thrown.
		if (isRedirect(thrown)) return { ok: true };
		if (!(thrown instanceof CredentialsSignin)) throw thrown;
		const reason = REFUSALS.find((r) => r === thrown.code) ?? 'credentials';
		const retryAfter_s =
			reason === 'throttled'
				? retryAfterSeconds(event.locals.db, throttleKeys(email, event.getClientAddress()))
				: 0;
		return { ok: false, reason, retryAfter_s };
	}
	return { ok: true };
}
