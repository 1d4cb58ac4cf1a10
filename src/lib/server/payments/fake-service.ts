import { createServer, type IncomingMessage, type ServerResponse } from 'node:http';
import type { AddressInfo } from 'node:net';
import { timingSafeEqual } from 'node:crypto';
import { collectBody } from '../api';
import type { Db } from '../db/open';
import { invalidRequest, parseCreateSession, type ServiceError } from './fake-request';
import { createFakeSession, findFakeSession, sessionObject } from './fake-sessions';

export type FakePaymentService = { port: number; close(): Promise<void> };

/** A session's form is a few hundred bytes; anything near this is not from the app. */
const MAX_BODY_BYTES = 64 * 1024;
const SESSION_PATH = /^\/v1\/checkout\/sessions\/(cs_test_[0-9a-f]{1,100})$/;

function answer(response: ServerResponse, status: number, body: unknown) {
	response.writeHead(status, { 'content-type': 'application/json' });
	response.end(JSON.stringify(body));
}

function answerError(response: ServerResponse, { status, error }: ServiceError) {
	answer(response, status, { error });
}

function bearerMatches(request: IncomingMessage, apiKey: string): boolean {
	const given = Buffer.from(/^Bearer (.+)$/.exec(request.headers.authorization ?? '')?.[1] ?? '');
	const expected = Buffer.from(apiKey);
	return given.length === expected.length && timingSafeEqual(given, expected);
}

function pathOf(request: IncomingMessage): string | null {
	try {
		return new URL(request.url ?? '/', 'http://stand-in').pathname;
	} catch {
		return null;
	}
}

async function route(db: Db, apiKey: string, request: IncomingMessage, response: ServerResponse) {
	if (!bearerMatches(request, apiKey)) {
		return answerError(response, {
			status: 401,
			error: { type: 'invalid_request_error', message: 'Invalid API Key provided.' }
		});
	}
	const path = pathOf(request);
	if (path === null) return answerError(response, invalidRequest('The request URL is not valid.'));
	if (request.method === 'POST' && path === '/v1/checkout/sessions') {
		const bytes = await collectBody(request, request.headers['content-length'], MAX_BODY_BYTES);
		if (bytes === null)
			return answerError(response, {
				...invalidRequest('The request body is too large.'),
				status: 413
			});
		const parsed = parseCreateSession(new TextDecoder().decode(bytes));
		if ('error' in parsed) return answerError(response, parsed);
		return answer(response, 200, sessionObject(createFakeSession(db, parsed)));
	}
	const id = SESSION_PATH.exec(path)?.[1];
	if (request.method === 'GET' && id) {
		const session = findFakeSession(db, id);
		if (!session)
			return answerError(response, {
				...invalidRequest(`No such checkout.session: '${id}'`, 'resource_missing', 'session'),
				status: 404
			});
		return answer(response, 200, sessionObject(session));
	}
	answerError(response, {
		...invalidRequest(
			`Unrecognized request URL (${String(request.method).slice(0, 10)}: ${path.slice(0, 200)}).`
		),
		status: 404
	});
}

/**
 * A stand-in for the payment service's checkout API on loopback, for demos and tests: it takes
 * the calls the app makes through the SDK and keeps its sessions in the database, so every app
 * process on the same database serves the same ones. No card is ever asked for.
 */
export function startFakePaymentService(db: Db, apiKey: string): Promise<FakePaymentService> {
	const server = createServer((request, response) => {
		route(db, apiKey, request, response).catch((error: unknown) => {
			console.error('Local payment stand-in:', error);
			if (!response.headersSent)
				answerError(response, {
					status: 500,
					error: { type: 'api_error', message: 'The stand-in could not answer.' }
				});
			else response.destroy();
		});
	});
	return new Promise((resolve, reject) => {
		server.once('error', reject);
		server.listen(0, '127.0.0.1', () => {
			server.off('error', reject);
			// adapter-node exits once its own server has closed; the stand-in must not hold it open.
			server.unref();
			const { port } = server.address() as AddressInfo;
			resolve({
				port,
				close: () => new Promise((done) => server.close(() => done()))
			});
		});
	});
}
