import { isHttpError, type RequestEvent } from '@sveltejs/kit';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';

// Each route's handler takes its own typed event; the tests build one event shape for all.
export type Handler = (event: never) => unknown;

export type RouteCall = {
	method?: string;
	/** A value sent as JSON. */
	body?: unknown;
	/** A body sent as it is, such as a CSV file. */
	raw?: BodyInit;
	headers?: Record<string, string>;
	params?: Record<string, string>;
	search?: string;
	apiToken?: App.Locals['apiToken'];
};

/**
 * Calls a route handler as the framework would, with the database and user in `locals`; a
 * thrown error(...) becomes its status. JSON answers are parsed, NDJSON ones into their lines.
 */
export async function callRoute(
	handler: Handler,
	db: Db,
	user: SessionUser | null,
	init: RouteCall = {}
) {
	const hasBody = init.raw !== undefined || init.body !== undefined;
	const request = new Request(`http://localhost/api${init.search ?? ''}`, {
		method: init.method ?? (hasBody ? 'POST' : 'GET'),
		body: init.raw ?? (init.body === undefined ? undefined : JSON.stringify(init.body)),
		headers: init.headers
	});
	try {
		const response = (await handler({
			request,
			url: new URL(request.url),
			params: init.params ?? {},
			locals: { db, user, apiToken: init.apiToken ?? null }
		} as unknown as RequestEvent as never)) as Response;
		const text = await response.text();
		const lines = response.headers.get('content-type') === 'application/x-ndjson';
		return {
			status: response.status,
			headers: response.headers,
			body: lines
				? text
						.trim()
						.split('\n')
						.map((l) => JSON.parse(l))
				: text
					? JSON.parse(text)
					: null
		};
	} catch (thrown) {
		if (isHttpError(thrown))
			return { status: thrown.status, headers: new Headers(), body: thrown.body };
		throw thrown;
	}
}
