import {
	redirect,
	text,
	type Handle,
	type HandleServerError,
	type ServerInit
} from '@sveltejs/kit';
import { sequence } from '@sveltejs/kit/hooks';
import { apiError, tooLarge, tooLargeMessage } from '$lib/server/api';
import { bodyLimitOf } from '$lib/server/body-limits';
import { authHandle } from '$lib/server/auth';
import { authSecret } from '$lib/server/auth/secret';
import { sessionUserOf } from '$lib/server/auth/session-cookie';
import { authenticateBearer } from '$lib/server/auth/bearer';
import { retryAfterSeconds, throttleKeys } from '$lib/server/auth/throttle';
import { getDb } from '$lib/server/db';
import { busyResponse, isDatabaseBusy } from '$lib/server/db/busy';
import { startMail } from '$lib/server/mail';
import { startPayments } from '$lib/server/payments';
import { fileStore, startFileStore } from '$lib/server/storage';

/**
 * Open and migrate the database, start mail delivery and open the file store and the payment
 * service before the first request is served.
 */
export const init: ServerInit = async () => {
	await Promise.all([startMail(getDb()), startFileStore(), startPayments(getDb())]);
};

const attachDatabase: Handle = ({ event, resolve }) => {
	event.locals.db = getDb();
	event.locals.files = fileStore();
	event.locals.user = null;
	event.locals.apiToken = null;
	return resolve(event);
};

const isApi = (url: URL) => url.pathname.startsWith('/api/');

/**
 * A request whose write waited out the busy timeout behind another process answers 503 with
 * Retry-After; `handleError` marks it, since the framework has already made it a 500.
 */
const answerBusyDatabase: Handle = async ({ event, resolve }) => {
	try {
		const response = await resolve(event);
		return event.locals.databaseBusy ? busyResponse(isApi(event.url)) : response;
	} catch (error) {
		// A hook's own write (the sign-in throttle, say) fails here, before any route ran.
		if (isDatabaseBusy(error)) return busyResponse(isApi(event.url));
		throw error;
	}
};

const CODE_OF_STATUS: Record<number, string> = {
	400: 'invalid',
	401: 'unauthenticated',
	403: 'forbidden',
	404: 'not-found',
	405: 'method-not-allowed',
	409: 'conflict',
	413: 'too-large',
	429: 'throttled'
};

/** Every API failure, thrown by a guard or answered by the framework, as `{ error: { … } }`. */
const shapeApiErrors: Handle = async ({ event, resolve }) => {
	const response = await resolve(event);
	if (!isApi(event.url) || response.status < 400) return response;
	const body = await response
		.clone()
		.json()
		.catch(() => null);
	if (body && typeof body === 'object' && 'error' in body) return response;
	const code = body?.code ?? CODE_OF_STATUS[response.status] ?? 'server-error';
	const message =
		typeof body?.message === 'string' ? body.message : response.statusText || 'Request failed.';
	const shaped = apiError(response.status, code, message, body?.fields);
	const retryAfter = response.headers.get('retry-after');
	if (retryAfter) shaped.headers.set('retry-after', retryAfter);
	return shaped;
};

/**
 * Refuses a declared body over the limit before anything reads it. adapter-node's own
 * BODY_SIZE_LIMIT also stops bodies sent without a length, mid-stream.
 */
const rejectOversizedBodies: Handle = async ({ event, resolve }) => {
	const declared = Number(event.request.headers.get('content-length') ?? 0);
	const limit = bodyLimitOf(event.route.id);
	if (!(declared > limit)) return resolve(event);
	// Read and drop what was sent (adapter-node stops at BODY_SIZE_LIMIT), so the client hears
	// the refusal instead of a connection reset while it is still sending.
	await event.request.body?.pipeTo(new WritableStream()).catch(() => undefined);
	// A page answers in words: the API's JSON error is not a form action's result.
	return isApi(event.url) ? tooLarge(limit) : text(tooLargeMessage(limit), { status: 413 });
};

const FORM_MEDIA_TYPES = new Set(['application/x-www-form-urlencoded', 'multipart/form-data']);

/**
 * Posts to pages must be forms. SvelteKit also lets text/plain through to the actions (an HTML
 * form may send it), and no action can read it.
 */
const refuseNonFormPosts: Handle = ({ event, resolve }) => {
	if (event.request.method !== 'POST' || isApi(event.url)) return resolve(event);
	const mediaType = (event.request.headers.get('content-type') ?? '').split(';')[0]!.trim();
	if (FORM_MEDIA_TYPES.has(mediaType.toLowerCase())) return resolve(event);
	return text('Send the form as application/x-www-form-urlencoded or multipart/form-data.', {
		status: 415
	});
};

/** Scripts post credentials straight to Auth.js; a throttled account or address gets 429. */
const throttleCredentialPosts: Handle = async ({ event, resolve }) => {
	if (event.request.method === 'POST' && event.url.pathname === '/auth/callback/credentials') {
		const form = await event.request
			.clone()
			.formData()
			.catch(() => null);
		const email = form?.get('email');
		if (typeof email === 'string') {
			const wait = retryAfterSeconds(
				event.locals.db,
				throttleKeys(email, event.getClientAddress())
			);
			if (wait > 0) {
				const response = apiError(429, 'throttled', 'Too many failed sign-ins; try again later.');
				response.headers.set('retry-after', String(wait));
				return response;
			}
		}
	}
	return resolve(event);
};

const READS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * A write to the API carrying the session cookie must come from the app's own pages: browsers
 * send Origin on every cross-site and every non-GET request, and SvelteKit's own check covers
 * form content types only. Calls with an API token carry no ambient credential and are exempt.
 */
const requireOwnOriginForCookieWrites: Handle = ({ event, resolve }) => {
	const cookieSigned = event.locals.user && !event.locals.apiToken;
	if (READS.has(event.request.method) || !isApi(event.url) || !cookieSigned) return resolve(event);
	if (event.request.headers.get('origin') === event.url.origin) return resolve(event);
	return apiError(
		403,
		'cross-origin',
		'A write signed in by cookie must come from this site (send its Origin header), or use an API token.'
	);
};

const resolveUser: Handle = async ({ event, resolve }) => {
	// A request signed with a token acts as its owner only, whatever cookie comes along.
	if (event.locals.apiToken) return resolve(event);
	event.locals.user = await sessionUserOf({
		cookies: event.cookies,
		url: event.url,
		db: event.locals.db,
		secret: authSecret()
	});
	return resolve(event);
};

/** Signed-out visitors of product pages go to sign-in; each load still checks for itself. */
const sendSignedOutToSignIn: Handle = ({ event, resolve }) => {
	if (!event.locals.user && event.route.id?.startsWith('/(app)')) {
		const back = event.url.pathname + event.url.search;
		redirect(303, `/signin?redirectTo=${encodeURIComponent(back)}`);
	}
	return resolve(event);
};

const productHandles = sequence(
	attachDatabase,
	answerBusyDatabase,
	shapeApiErrors,
	rejectOversizedBodies,
	refuseNonFormPosts,
	throttleCredentialPosts,
	authHandle,
	authenticateBearer,
	resolveUser,
	requireOwnOriginForCookieWrites,
	sendSignedOutToSignIn
);

/** The readiness probe gets the database and nothing else: no session, token or body work. */
export const handle: Handle = (input) =>
	input.event.url.pathname === '/healthz' ? attachDatabase(input) : productHandles(input);

export const handleError: HandleServerError = ({ error, event, status, message }) => {
	if (isDatabaseBusy(error)) event.locals.databaseBusy = true;
	else if (status >= 500) console.error(error);
	return { message: status >= 500 ? 'Something went wrong on the server.' : message };
};
