/**
 * The fuzz's own app instance and its client: sessions without a browser, one request at a
 * time with its wall time, and the verdict on each answer.
 */
import { request as httpRequest } from 'node:http';
import { signInCookie } from './http-session';

export const ACTORS = ['aero', 'reviewer', 'operator', 'admin', 'anonymous'] as const;
export type Actor = (typeof ACTORS)[number];

export type Sessions = Record<Actor, string>;

export async function signInAll(baseUrl: string): Promise<Sessions> {
	const sessions = { anonymous: '' } as Sessions;
	for (const actor of ACTORS.filter((a) => a !== 'anonymous')) {
		const cookie = await signInCookie(baseUrl, `${actor}@demo.test`);
		sessions[actor] = cookie;
	}
	return sessions;
}

export type Exchange = {
	target: string;
	request: string;
	status: number;
	ms: number;
	problem: string | null;
};

/**
 * Past this a request counts as stalled rather than slow; generous, as the machine may be busy.
 * Slow requests are listed by time at the end instead.
 */
const STALLED_MS = 10_000;

/**
 * After a stalled or dropped request, waits until the app answers again, so the next target is
 * not blamed for the one that tied the server up.
 */
export async function awaitRecovery(baseUrl: string): Promise<void> {
	const deadline = Date.now() + 120_000;
	while (Date.now() < deadline) {
		const up = await fetch(new URL('/signin', baseUrl), {
			signal: AbortSignal.timeout(5_000)
		}).then(
			(r) => r.status < 500,
			() => false
		);
		if (up) return;
		await new Promise((r) => setTimeout(r, 250));
	}
	throw new Error('The app did not recover within 2 minutes.');
}

export type Sent = { status: number; ms: number; mediaType: string; text: string };

/**
 * One request on a connection of its own (node:http without keep-alive), so a connection the
 * app leaves in a bad state is blamed on the request that did it, not on the next one.
 */
export function send(
	url: URL,
	init: { method: string; headers: Record<string, string>; body?: Uint8Array }
): Promise<Sent> {
	const started = performance.now();
	const body = init.method === 'GET' ? undefined : init.body;
	return new Promise((resolve) => {
		const done = (status: number, mediaType: string, text: string) =>
			resolve({ status, ms: performance.now() - started, mediaType, text });
		const request = httpRequest(url, {
			method: init.method,
			agent: false,
			headers: { ...init.headers, ...(body ? { 'content-length': String(body.byteLength) } : {}) },
			timeout: STALLED_MS
		});
		request.on('timeout', () => {
			request.destroy();
			done(0, '', `no answer within ${STALLED_MS} ms`);
		});
		request.on('error', (error: NodeJS.ErrnoException) =>
			done(-1, '', `${error.code}: ${error.message}`)
		);
		request.on('response', (response) => {
			const chunks: Buffer[] = [];
			response.on('data', (chunk: Buffer) => chunks.push(chunk));
			response.on('error', (error: NodeJS.ErrnoException) =>
				done(-1, '', `${error.code}: ${error.message}`)
			);
			response.on('end', () =>
				done(
					response.statusCode ?? -1,
					(response.headers['content-type'] ?? '').split(';')[0]!.trim(),
					Buffer.concat(chunks).toString('utf8')
				)
			);
		});
		request.end(body ? Buffer.from(body) : undefined);
	});
}

/** The framework's redirects of an odd path (a trailing slash or space is normalised away). */
const REDIRECTS = [301, 303, 307, 308];
/** Refusals the API documents (README, Calculation API), besides its successes. */
const API_STATUSES = new Set([
	200,
	201,
	204,
	...REDIRECTS,
	400,
	401,
	403,
	404,
	409,
	412,
	413,
	415,
	428,
	429
]);
/**
 * What a form action may answer: success, redirect, or a refusal of the request. Sign-out is
 * Auth.js's own action, which redirects with 302.
 */
const FORM_STATUSES = new Set([
	200,
	204,
	302,
	...REDIRECTS,
	400,
	403,
	404,
	409,
	410,
	413,
	415,
	429
]);

function parse(text: string): unknown {
	try {
		return JSON.parse(text);
	} catch {
		return undefined;
	}
}

/** What is wrong with an API error body, if anything: `{ error: { code, message, fields? } }`. */
function apiErrorProblem(body: unknown): string | null {
	const error = (body as { error?: Record<string, unknown> } | undefined)?.error;
	if (!error || typeof error !== 'object') return 'error body is not { error: { … } }';
	if (typeof error.code !== 'string' || !error.code) return 'error.code is not a string';
	if (typeof error.message !== 'string' || !error.message) return 'error.message is not a string';
	const fields = error.fields;
	if (fields === undefined) return null;
	const wellFormed =
		fields !== null &&
		typeof fields === 'object' &&
		Object.values(fields).every(
			(messages) => Array.isArray(messages) && messages.every((m) => typeof m === 'string')
		);
	return wellFormed ? null : 'error.fields is not { field: [messages] }';
}

function statusProblem(sent: Sent, allowed: Set<number>): string | null {
	if (sent.status === 0) return `stalled past ${STALLED_MS} ms`;
	if (sent.status < 0) return `connection failed: ${sent.text.slice(0, 120)}`;
	if (sent.status >= 500) return `answered ${sent.status}`;
	return allowed.has(sent.status) ? null : `answered ${sent.status}, not a documented status`;
}

/** The readings upload's streamed answer: progress lines, then `{ type: 'result', status, body }`. */
function streamProblem(text: string): string | null {
	const lines = text.trim().split('\n').map(parse);
	const result = lines.at(-1) as { type?: string; status?: number; body?: unknown } | undefined;
	if (result?.type !== 'result' || typeof result.status !== 'number')
		return 'stream did not end in a result line';
	if (result.status >= 500) return `stream result ${result.status}`;
	return result.status >= 400 ? apiErrorProblem(result.body) : null;
}

export function apiProblem(sent: Sent): string | null {
	const status = statusProblem(sent, API_STATUSES);
	if (status) return status;
	if (sent.mediaType === 'application/x-ndjson') return streamProblem(sent.text);
	if (sent.status < 400) return null;
	if (sent.mediaType !== 'application/json')
		return `error answered as ${sent.mediaType || 'nothing'}`;
	return apiErrorProblem(parse(sent.text));
}

/** Other endpoints and page loads: no server error, whatever they answer. */
export function pageProblem(sent: Sent): string | null {
	if (sent.status === 0 || sent.status < 0 || sent.status >= 500)
		return statusProblem(sent, new Set());
	return null;
}

/**
 * A form action. Asked for JSON, SvelteKit answers `{ type, status?, … }` with HTTP 200 for a
 * failure and the error's own status for a thrown error.
 */
export function actionProblem(sent: Sent, askedJson: boolean): string | null {
	const status = statusProblem(sent, FORM_STATUSES);
	if (status || !askedJson || sent.mediaType !== 'application/json') return status;
	const result = parse(sent.text) as { type?: string; status?: number } | undefined;
	if (!result || !['success', 'failure', 'redirect', 'error'].includes(result.type ?? ''))
		return 'not an action result';
	if (result.type === 'failure' && !FORM_STATUSES.has(result.status ?? 0))
		return `failure with status ${result.status}`;
	return null;
}
