import type { ReceivePhase } from '../../readings/types';
import { STATUS_OF_REFUSAL } from '../outcome';
import type { ReadingsFile, ReadingsRefusal } from './receive';

/** How the readings API answers a post: a status and a JSON body, sent whole or as a stream's last line. */
export type ApiAnswer = { status: number; body: unknown };

const MEDIA_TYPES = {
	'text/csv': 'text/csv',
	'text/plain': 'text/csv',
	'application/json': 'application/json'
} as const;

/** The readings format a request's Content-Type declares; undefined for one not taken. */
export function declaredMediaType(
	contentType: string | null
): ReadingsFile['mediaType'] | undefined {
	const declared = (contentType ?? '').split(';')[0]!.trim().toLowerCase();
	return MEDIA_TYPES[declared as keyof typeof MEDIA_TYPES];
}

/**
 * The file name a client sent (URI-encoded, so any name survives the header), cut to 200
 * characters; a plain default when none, or one that does not decode, was sent.
 */
export function sentFileName(header: string | null, mediaType: ReadingsFile['mediaType']): string {
	const fallback = mediaType === 'text/csv' ? 'readings.csv' : 'readings.json';
	try {
		return (decodeURIComponent(header ?? '').trim() || fallback).slice(0, 200);
	} catch {
		return fallback;
	}
}

/** A refusal as the API's error body, with the file's problems or the points already read. */
export function readingsRefusalAnswer(refusal: ReadingsRefusal): ApiAnswer {
	const { ok: _, code, message, field: __, ...details } = refusal;
	return {
		status: STATUS_OF_REFUSAL[code],
		body: { error: { code: code === 'invalid' ? 'invalid-readings' : code, message, ...details } }
	};
}

type Progress = (phase: ReceivePhase, done: number, total: number) => void;

/**
 * The answer as NDJSON: a progress line as each phase moves, then the result line. A failure
 * after the stream has begun cannot change the status, so it ends the stream as a 500 result.
 */
export function progressStream(run: (progress: Progress) => Promise<ApiAnswer>): Response {
	const encoder = new TextEncoder();
	const stream = new ReadableStream({
		async start(controller) {
			const send = (line: unknown) =>
				controller.enqueue(encoder.encode(JSON.stringify(line) + '\n'));
			try {
				send({
					type: 'result',
					...(await run((phase, done, total) => send({ type: 'progress', phase, done, total })))
				});
			} catch (error) {
				console.error(error);
				send({
					type: 'result',
					status: 500,
					body: { error: { code: 'server-error', message: 'Something went wrong on the server.' } }
				});
			}
			controller.close();
		}
	});
	return new Response(stream, {
		headers: { 'content-type': 'application/x-ndjson', 'cache-control': 'no-store' }
	});
}
