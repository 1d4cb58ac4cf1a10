import type { Cookies, RequestEvent } from '@sveltejs/kit';
import type { SessionUser } from '../../src/lib/roles';
import type { Db } from '../../src/lib/server/db/open';
import type { ObjectStore } from '../../src/lib/server/storage/object-store';

export type EventInit = {
	db?: Db;
	/** The file store; routes that keep or serve files need one. */
	files?: ObjectStore;
	user?: SessionUser | null;
	apiToken?: App.Locals['apiToken'];
	method?: string;
	/** Path and query, such as `/api/v1/campaigns?state=draft`. */
	path?: string;
	routeId?: string | null;
	params?: Record<string, string>;
	headers?: Record<string, string>;
	/** A value sent as JSON. */
	json?: unknown;
	/** Fields sent as a submitted form; a list sends the name once per value. */
	form?: Record<string, string | string[]>;
	/** A body sent as it is, such as a CSV file. */
	raw?: BodyInit;
	clientAddress?: string;
};

/** Cookies kept in a map, enough for code that reads and writes them during one request. */
function cookieJar(): Cookies {
	const jar = new Map<string, string>();
	return {
		get: (name) => jar.get(name),
		getAll: () => [...jar].map(([name, value]) => ({ name, value })),
		set: (name, value) => void jar.set(name, value),
		delete: (name) => void jar.delete(name),
		serialize: (name, value) => `${name}=${encodeURIComponent(value)}`
	};
}

function bodyOf(init: EventInit): BodyInit | undefined {
	if (init.raw !== undefined) return init.raw;
	if (init.json !== undefined) return JSON.stringify(init.json);
	if (init.form === undefined) return undefined;
	const form = new FormData();
	for (const [name, value] of Object.entries(init.form)) {
		for (const one of [value].flat()) form.append(name, one);
	}
	return form;
}

/**
 * The request event SvelteKit hands to a handle, load, action or `+server` handler, with the
 * database and user in `locals`. A body makes it a POST unless `method` says otherwise.
 */
export function requestEvent(init: EventInit = {}): RequestEvent {
	const body = bodyOf(init);
	const headers = new Headers(init.headers);
	if (init.json !== undefined && !headers.has('content-type')) {
		headers.set('content-type', 'application/json');
	}
	const request = new Request(`http://localhost${init.path ?? '/'}`, {
		method: init.method ?? (body === undefined ? 'GET' : 'POST'),
		headers,
		body
	});
	// Auth.js's own functions in locals are left out: the user is given as hooks would resolve it.
	const locals = {
		db: init.db,
		files: init.files,
		user: init.user ?? null,
		apiToken: init.apiToken ?? null
	} as App.Locals;
	return {
		request,
		url: new URL(request.url),
		params: init.params ?? {},
		route: { id: init.routeId ?? null },
		locals,
		cookies: cookieJar(),
		getClientAddress: () => init.clientAddress ?? '127.0.0.1',
		fetch,
		setHeaders: () => {},
		platform: undefined,
		isDataRequest: false,
		isSubRequest: false,
		isRemoteRequest: false
	} as unknown as RequestEvent;
}
