import type { Handle } from '@sveltejs/kit';
import { CredentialsSignin, SvelteKitAuth } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import { signInSchema } from '../../schemas/user';
import { getDb } from '../db';
import { checkCredentials, type SignInRefusal } from './credentials';
import { authSecret } from './secret';
import { secureCookies } from './session-cookie';
import { SESSION_MAX_AGE_S } from './session-lifetime';
import { decodeSessionToken, encodeSessionToken } from './session-token';

class SignInRefused extends CredentialsSignin {
	constructor(reason: SignInRefusal) {
		super();
		this.code = reason;
	}
}

/**
 * Auth.js signs in and out and writes the session cookie at sign-in. The hooks read the cookie
 * themselves on every other request (`session-cookie.ts`), through the same token codec and
 * cookie name, so both agree on the format and on when the cookie is Secure.
 */
const {
	handle: authJsHandle,
	signIn,
	signOut
} = SvelteKitAuth(async (event) => {
	const db = getDb();
	return {
		secret: authSecret(),
		trustHost: true,
		useSecureCookies: secureCookies(event.url),
		session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
		jwt: { encode: encodeSessionToken, decode: decodeSessionToken },
		pages: { signIn: '/signin', error: '/signin' },
		logger: {
			error(error) {
				// A refused sign-in is an expected outcome, not a server fault.
				if (!(error instanceof CredentialsSignin)) console.error(error);
			}
		},
		providers: [
			Credentials({
				credentials: { email: {}, password: {} },
				async authorize(credentials) {
					const parsed = signInSchema.safeParse(credentials);
					if (!parsed.success) throw new SignInRefused('credentials');
					const check = await checkCredentials(db, parsed.data, event.getClientAddress());
					if (!check.ok) throw new SignInRefused(check.reason);
					return check.user;
				}
			})
		],
		callbacks: {
			jwt({ token, user }) {
				if (user) {
					token.sessionVersion = (user as { sessionVersion: number }).sessionVersion;
					token.signedInAt = Date.now();
				}
				return token;
			},
			session({ session, token }) {
				return {
					...session,
					user: { ...session.user, id: token.sub ?? '' },
					sessionVersion: Number(token.sessionVersion ?? 0),
					signedInAt: Number(token.signedInAt ?? 0)
				};
			}
		}
	};
});

export { signIn, signOut };

/**
 * Auth.js's own endpoints (sign-in callback, sign-out, CSRF). Other requests skip it, so they
 * have no `locals.auth`: the hooks resolve `locals.user` from the cookie instead.
 */
export const authHandle: Handle = (input) =>
	input.event.url.pathname.startsWith('/auth/') ? authJsHandle(input) : input.resolve(input.event);
