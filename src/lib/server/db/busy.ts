import { text } from '@sveltejs/kit';
import { apiError } from '../api';

/** Seconds a client is asked to wait when another process held the database too long. */
export const BUSY_RETRY_AFTER_S = 2;

/**
 * SQLite's answer when its busy timeout ran out (SQLITE_BUSY and its extended codes) or a
 * table stayed locked: the request did nothing, and the same request a moment later will work.
 */
export function isDatabaseBusy(error: unknown): boolean {
	const code = (error as { code?: unknown } | null)?.code;
	return typeof code === 'string' && /^SQLITE_(BUSY|LOCKED)/.test(code);
}

/** 503 with Retry-After (RFC 9110 §15.6.4, §10.2.3), in the API's shape or in words for pages. */
export function busyResponse(api: boolean): Response {
	const message = 'The database is busy with other writes; nothing was changed. Try again shortly.';
	const response = api ? apiError(503, 'busy', message) : text(message, { status: 503 });
	response.headers.set('retry-after', String(BUSY_RETRY_AFTER_S));
	return response;
}
