import { json } from '@sveltejs/kit';
import { apiError } from './api';
import { entityTag, type BaseVersion } from './versions';

/**
 * HTTP's conditional writes (RFC 9110 §8.8.3 ETag, §13.1.1 If-Match; RFC 6585 §3 for 428) over
 * the version every editable record carries.
 */

const TAG = /^"(\d{1,15})"$/;

/**
 * The version a PUT names in If-Match. Without one the write is refused with 428: a client that
 * does not say what it read would silently overwrite another's edit. `*` overwrites whatever is
 * stored, deliberately.
 */
export function expectedVersion(
	request: Request
): { ok: true; base: BaseVersion } | { ok: false; response: Response } {
	const header = request.headers.get('if-match')?.trim();
	if (!header)
		return refused(
			apiError(
				428,
				'precondition-required',
				'Send If-Match with the ETag a GET of this record answered, or * to overwrite whatever is stored.'
			)
		);
	if (header === '*') return { ok: true, base: 'any' };
	const tag = TAG.exec(header);
	if (!tag)
		return refused(
			apiError(
				400,
				'invalid',
				'If-Match must be one ETag this API answered, such as "3", or *; weak tags (W/) never match.'
			)
		);
	return { ok: true, base: Number(tag[1]) };
}

const refused = (response: Response) => ({ ok: false as const, response });

/** A record's JSON with its ETag, for GET and for the answer to a successful PUT. */
export function versionedJson(body: unknown, version: number, init: ResponseInit = {}): Response {
	const response = json(body, init);
	response.headers.set('etag', entityTag(version));
	return response;
}
