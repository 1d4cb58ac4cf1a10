import { CredentialsSignin, SvelteKitAuth } from '@auth/sveltekit';
import Credentials from '@auth/sveltekit/providers/credentials';
import { env } from '$env/dynamic/private';
import { signInSchema } from '../../schemas/user';
import { getDb } from '../db';
import { storedSecret } from '../settings';
import { checkCredentials, type SignInRefusal } from './credentials';
import { SESSION_MAX_AGE_S } from './session-lifetime';

class SignInRefused extends CredentialsSignin {
	constructor(reason: SignInRefusal) {
		super();
		this.code = reason;
	}
}

export const {
	handle: authHandle,
	signIn,
	signOut
} = SvelteKitAuth(async (event) => {
	const db = getDb();
	return {
		secret: env.AUTH_SECRET || storedSecret(db, 'auth-secret'),
		trustHost: true,
		session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE_S },
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
