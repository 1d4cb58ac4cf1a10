import { json, type RequestEvent, type RequestHandler } from '@sveltejs/kit';
import type { z } from 'zod';
import { CalcInputError } from '../calc';
import { requestWording } from '../schemas/calc';
import { requireUser } from './guards';
import type { StaleDetail } from '../versions';
import { STATUS_OF_REFUSAL, type Refusal } from './outcome';
import { entityTag, type StaleRefusal } from './versions';

/** Largest request body the app reads; a campaign definition is far smaller. */
export const MAX_REQUEST_BODY_BYTES = 1024 * 1024;

export type ApiErrorBody = {
	error: {
		code: string;
		message: string;
		fields?: Record<string, string[]>;
		/** With 412: the stored version now, who saved it and what changed since the caller read. */
		stale?: StaleDetail;
	};
};

export function apiError(
	status: number,
	code: string,
	message: string,
	fields?: Record<string, string[]>
): Response {
	const body: ApiErrorBody = { error: { code, message, ...(fields ? { fields } : {}) } };
	return json(body, { status });
}

export function refusalResponse(refusal: Refusal | StaleRefusal): Response {
	if ('stale' in refusal) {
		const body: ApiErrorBody = {
			error: { code: refusal.code, message: refusal.message, stale: refusal.stale }
		};
		return json(body, { status: 412, headers: { etag: entityTag(refusal.stale.version) } });
	}
	const fields = refusal.field ? { [refusal.field]: [refusal.message] } : undefined;
	return apiError(STATUS_OF_REFUSAL[refusal.code], refusal.code, refusal.message, fields);
}

/** zod issues as `{ "a.b": ["message"] }`, the shape forms and API clients both read. */
export function fieldMessages(error: z.ZodError): Record<string, string[]> {
	const fields: Record<string, string[]> = {};
	for (const issue of error.issues) {
		// A refusal of the body as a whole is filed under `body`: clients never see a bare `_`.
		const key = issue.path.length ? issue.path.join('.') : 'body';
		(fields[key] ??= []).push(issue.message);
	}
	return fields;
}

type Parsed<T> = { ok: true; data: T } | { ok: false; response: Response };

/** Reads and validates a JSON body: 413 past the size limit, 400 with field messages otherwise. */
export async function readJson<S extends z.ZodType>(
	event: RequestEvent,
	schema: S
): Promise<Parsed<z.output<S>>> {
	const text = await event.request.text();
	if (Buffer.byteLength(text) > MAX_REQUEST_BODY_BYTES) return { ok: false, response: tooLarge() };
	let raw: unknown;
	try {
		raw = JSON.parse(text);
	} catch {
		return {
			ok: false,
			response: apiError(400, 'invalid-json', 'The request body is not valid JSON.')
		};
	}
	const parsed = schema.safeParse(raw);
	if (!parsed.success) {
		return {
			ok: false,
			response: apiError(400, 'invalid', 'Some fields are not valid.', fieldMessages(parsed.error))
		};
	}
	return { ok: true, data: parsed.data };
}

/**
 * Body bytes as they stream in, abandoned at `limit_bytes` (and refused up front by a declared
 * length over it), so a body sent without a length cannot make the server hold more than the
 * limit. Null when it is over. Takes a web stream or a Node request alike.
 */
export async function collectBody(
	chunks: AsyncIterable<Uint8Array> | null,
	declaredLength: string | null | undefined,
	limit_bytes: number
): Promise<Uint8Array | null> {
	if (Number(declaredLength ?? 0) > limit_bytes) return null;
	const parts: Uint8Array[] = [];
	let size = 0;
	// Leaving the loop early cancels the stream.
	for await (const chunk of chunks ?? []) {
		size += chunk.byteLength;
		if (size > limit_bytes) return null;
		parts.push(chunk);
	}
	return Buffer.concat(parts, size);
}

/** A request's raw body within `limit_bytes`, or null when it is over (see collectBody). */
export function readBody(request: Request, limit_bytes: number): Promise<Uint8Array | null> {
	// Node's web streams are async iterable; the DOM typings the project compiles with say not.
	const stream = request.body as AsyncIterable<Uint8Array> | null;
	return collectBody(stream, request.headers.get('content-length'), limit_bytes);
}

export function tooLargeMessage(limit_bytes = MAX_REQUEST_BODY_BYTES): string {
	return `The request body is over ${(limit_bytes / 1024 / 1024).toFixed(1)} MiB.`;
}

export function tooLarge(limit_bytes = MAX_REQUEST_BODY_BYTES): Response {
	return apiError(413, 'too-large', tooLargeMessage(limit_bytes));
}

/**
 * Runs a calculation; input the core refuses becomes a 400 naming the request's field, or
 * saying in words which derived figure was out of range.
 */
export function calculationResponse(
	run: () => unknown,
	requestKeys: readonly string[] = []
): Response {
	try {
		return json(run());
	} catch (error) {
		if (!(error instanceof CalcInputError)) throw error;
		const { field, message } = requestWording(error, requestKeys);
		return apiError(400, 'invalid', message, field ? { [field]: [message] } : undefined);
	}
}

/**
 * A POST handler for a calculation: any signed-in user, a zod-validated JSON body, the core's
 * answer as JSON in SI with the unit in each property name.
 */
export function calculationEndpoint<S extends z.ZodType>(
	schema: S,
	compute: (input: z.output<S>) => unknown
): RequestHandler {
	return async (event) => {
		requireUser(event.locals);
		const body = await readJson(event, schema);
		if (!body.ok) return body.response;
		const keys = body.data && typeof body.data === 'object' ? Object.keys(body.data) : [];
		return calculationResponse(() => compute(body.data), keys);
	};
}
