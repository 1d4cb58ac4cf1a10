/**
 * Talking to the built app without a browser: signing in through Auth.js's credentials endpoint
 * and calling pages, form actions and the JSON API as a given caller.
 */
import { DEMO_PASSWORD } from '../../scripts/demo-scenario';

/** How a request proves who sends it: nothing, a session cookie, or a personal API token. */
export type Credential = { cookie?: string; bearer?: string };

/** Posts credentials straight to Auth.js's endpoint, as a script without a browser does. */
export function postCredentials(
	baseUrl: string,
	email: string,
	password = DEMO_PASSWORD
): Promise<Response> {
	return fetch(new URL('/auth/callback/credentials', baseUrl), {
		method: 'POST',
		redirect: 'manual',
		headers: {
			'content-type': 'application/x-www-form-urlencoded',
			origin: new URL(baseUrl).origin
		},
		body: new URLSearchParams({ email, password })
	});
}

/** Signs in as `email` and answers the session cookie pairs, ready for a `cookie` header. */
export async function signInCookie(
	baseUrl: string,
	email: string,
	password = DEMO_PASSWORD
): Promise<string> {
	const cookie = (await postCredentials(baseUrl, email, password)).headers
		.getSetCookie()
		.map((c) => c.split(';')[0])
		.join('; ');
	if (!cookie.includes('session-token')) throw new Error(`Signing in as ${email} failed.`);
	return cookie;
}

export type Answer = {
	/** The HTTP status, or for a form action called for JSON the status its result names. */
	status: number;
	/** Where a redirect points, relative to the app. */
	location: string | null;
	body: string;
};

function headersFor(baseUrl: string, credential: Credential, extra: Record<string, string>) {
	const headers: Record<string, string> = { origin: new URL(baseUrl).origin, ...extra };
	if (credential.cookie) headers.cookie = credential.cookie;
	if (credential.bearer) headers.authorization = `Bearer ${credential.bearer}`;
	return headers;
}

function relative(location: string | null, baseUrl: string): string | null {
	if (!location) return null;
	const target = new URL(location, baseUrl);
	return target.origin === new URL(baseUrl).origin ? target.pathname + target.search : location;
}

/** A plain request; redirects are answered, not followed. */
export async function send(
	baseUrl: string,
	credential: Credential,
	method: string,
	path: string,
	{ body, headers = {} }: { body?: BodyInit; headers?: Record<string, string> } = {}
): Promise<Answer> {
	const answer = await fetch(new URL(path, baseUrl), {
		method,
		redirect: 'manual',
		headers: headersFor(baseUrl, credential, headers),
		body
	});
	return {
		status: answer.status,
		location: relative(answer.headers.get('location'), baseUrl),
		body: await answer.text()
	};
}

type ActionResult =
	| { type: 'failure' | 'success'; status: number }
	| { type: 'redirect'; status: number; location: string }
	| { type: 'error'; status?: number };

/**
 * Posts a form action (`name` null for the default one) asking for SvelteKit's JSON answer, and
 * reads the status out of the result, where a failure or redirect carries it.
 */
export async function postAction(
	baseUrl: string,
	credential: Credential,
	path: string,
	name: string | null,
	body: URLSearchParams | FormData = new URLSearchParams()
): Promise<Answer> {
	const target = name ? `${path}${path.includes('?') ? '&' : '?'}/${name}` : path;
	const answer = await send(baseUrl, credential, 'POST', target, {
		body,
		headers: {
			accept: 'application/json',
			...(body instanceof URLSearchParams
				? { 'content-type': 'application/x-www-form-urlencoded' }
				: {})
		}
	});
	let result: ActionResult | null = null;
	try {
		const parsed: unknown = JSON.parse(answer.body);
		if (parsed && typeof parsed === 'object' && 'type' in parsed) result = parsed as ActionResult;
	} catch {
		// Not an action result: a hook answered before the action ran.
	}
	if (!result) return answer;
	if (result.type === 'redirect')
		return { ...answer, status: result.status, location: relative(result.location, baseUrl) };
	if (result.type === 'error') return { ...answer, status: result.status ?? answer.status };
	return { ...answer, status: result.status };
}
