import { isHttpError } from '@sveltejs/kit';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import { requestEvent, type EventInit } from './request-event';

// Each route's handler takes its own typed event; the tests build one event shape for all.
export type Handler = (event: never) => unknown;

export type RouteCall = Pick<
	EventInit,
	'method' | 'raw' | 'headers' | 'params' | 'apiToken' | 'routeId' | 'files'
> & {
	/** A value sent as JSON. */
	body?: unknown;
	search?: string;
};

/**
 * Calls a route handler as the framework would, with the database and user in `locals`; a
 * thrown error(...) becomes its status. JSON answers are parsed, NDJSON ones into their lines.
 */
export async function callRoute(
	handler: Handler,
	db: Db,
	user: SessionUser | null,
	{ body, search, ...init }: RouteCall = {}
) {
	try {
		const response = (await handler(
			requestEvent({ ...init, db, user, json: body, path: `/api${search ?? ''}` }) as never
		)) as Response;
		const text = await response.text();
		const type = response.headers.get('content-type') ?? '';
		const lines = type === 'application/x-ndjson';
		return {
			status: response.status,
			headers: response.headers,
			body: lines
				? text
						.trim()
						.split('\n')
						.map((l) => JSON.parse(l))
				: !text
					? null
					: type.startsWith('application/json')
						? JSON.parse(text)
						: text
		};
	} catch (thrown) {
		if (isHttpError(thrown))
			return { status: thrown.status, headers: new Headers(), body: thrown.body };
		throw thrown;
	}
}
