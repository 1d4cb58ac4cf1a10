import type { Handle } from '@sveltejs/kit';
import { tokenScopeFor } from '../access';
import { apiError } from '../api';
import { authenticateApiToken } from '../api-tokens';

const BEARER = /^Bearer[ \t]+(\S+)[ \t]*$/i;

/** RFC 6750 §3: a refused bearer request names the problem in WWW-Authenticate. */
function refused(status: 401 | 403, code: string, message: string, challenge: string): Response {
	const response = apiError(status, code, message);
	response.headers.set('www-authenticate', `Bearer ${challenge}`);
	return response;
}

/**
 * Signs a request in as a personal API token's owner. A request that presents a token is
 * answered on the token alone: a bad one is refused rather than falling back to a session
 * cookie, so a misconfigured client learns at once.
 */
export const authenticateBearer: Handle = ({ event, resolve }) => {
	const header = event.request.headers.get('authorization');
	if (!header?.toLowerCase().startsWith('bearer')) return resolve(event);
	const secret = BEARER.exec(header)?.[1];
	const found =
		secret && event.url.pathname.startsWith('/api/')
			? authenticateApiToken(event.locals.db, secret)
			: null;
	if (!found) {
		return refused(
			401,
			'invalid-token',
			'The API token is unknown, revoked or expired, or only the JSON API takes tokens.',
			'error="invalid_token"'
		);
	}
	const needed = tokenScopeFor(event.request.method, event.route.id);
	if (!needed) {
		return refused(
			403,
			'token-not-accepted',
			'This request takes a signed-in session, not an API token.',
			'error="insufficient_scope"'
		);
	}
	if (!found.scopes.includes(needed)) {
		return refused(
			403,
			'insufficient-scope',
			`This request needs a token with the ${needed} scope.`,
			`error="insufficient_scope", scope="${needed}"`
		);
	}
	event.locals.user = found.user;
	event.locals.apiToken = { id: found.tokenId, scopes: found.scopes };
	return resolve(event);
};
