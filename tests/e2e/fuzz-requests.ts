/**
 * One fuzzed request to one target: who sends it, to which record, with what query, body,
 * content type and accept header; and sending it with the verdict on the answer.
 */
import fc from 'fast-check';
import {
	ACTORS,
	actionProblem,
	awaitRecovery,
	apiProblem,
	pageProblem,
	send,
	type Actor,
	type Exchange,
	type Sessions
} from './fuzz-app';
import { nastyScalar, formText } from './fuzz-arbitraries';
import { bodyFor, contentTypeChoice, encode, type Body, type Sample } from './fuzz-bodies';
import { routeParams, routePath, targetName, type Target } from './fuzz-routes';
import { QUERY_NAMES } from './fuzz-samples';

export type FuzzRequest = {
	actor: Actor;
	params: Record<string, string>;
	query: [string, string][];
	body: Body;
	contentType: string;
	accept: string;
	/** The version a write says it read; mostly `*`, so a PUT reaches its body. */
	ifMatch?: string;
};

const ifMatchChoice = fc.oneof(
	{ weight: 6, arbitrary: fc.constant('*') },
	fc.constantFrom(undefined, '"1"', '"999999999"', 'W/"1"', '1', '"-1"', '"1", "2"', ''),
	fc.string({ maxLength: 40 })
);

/** Odd record ids; none empty or `..`, which the client's URL parser would fold away. */
const ODD_SEGMENTS = ['NaN', '-0', '1e309', '0', '%00', '%F0%9F%8C%AC', '%E2%80%AE', '%ZZ', ' '];
const pathSegment = fc.oneof(
	fc.constantFrom(...ODD_SEGMENTS),
	fc.constant('x'.repeat(4000)),
	fc
		.string({ unit: 'grapheme', minLength: 1, maxLength: 20 })
		.map(encodeURIComponent)
		.filter((segment) => !/^\.{1,2}$/.test(segment))
);

const queryPair = fc.tuple(
	fc.oneof(
		{ weight: 4, arbitrary: fc.constantFrom(...QUERY_NAMES) },
		{ weight: 1, arbitrary: fc.string() }
	),
	nastyScalar.map(formText)
);

const ENDS_SESSIONS = /signout/;

export function requestFor(
	target: Target,
	primary: Actor,
	params: Record<string, string>,
	sample: Sample | undefined
): fc.Arbitrary<FuzzRequest> {
	const reads = target.kind === 'load' || (target.kind === 'endpoint' && target.method === 'GET');
	const names = routeParams(target.routeId);
	const ownParams = Object.fromEntries(names.map((n) => [n, params[n]!]));
	const oddParams = fc
		.tuple(...names.map(() => pathSegment))
		.map((values) => Object.fromEntries(names.map((n, i) => [n, values[i]!])));
	return fc.record({
		// Signing out ends every session of the user, the fuzz's own included: only as its actor.
		actor: ENDS_SESSIONS.test(targetName(target))
			? fc.constant(primary)
			: fc.oneof({ weight: 5, arbitrary: fc.constant(primary) }, fc.constantFrom(...ACTORS)),
		params: names.length
			? fc.oneof({ weight: 5, arbitrary: fc.constant(ownParams) }, oddParams)
			: fc.constant({}),
		query: fc.array(queryPair, { maxLength: reads ? 4 : 1 }),
		body: reads ? fc.constant({ encoding: 'none' as const }) : bodyFor(sample ?? { kind: 'none' }),
		contentType: contentTypeChoice,
		ifMatch: ifMatchChoice,
		accept:
			target.kind === 'action'
				? fc.constantFrom('application/json', 'application/json', 'text/html', '*/*')
				: fc.constantFrom('application/json', '*/*', 'text/html', 'application/x-ndjson')
	});
}

/** The request's address: the route's path, the action's name, then the fuzzed query. */
export function addressOf(target: Target, request: FuzzRequest, baseUrl: string): URL {
	const path = routePath(target.routeId, request.params);
	const action =
		target.kind === 'action' && target.action !== 'default' ? `/${target.action}` : null;
	const query = [
		...(action ? [action] : []),
		...request.query.map(([k, v]) => `${percentEncoded(k)}=${percentEncoded(v)}`)
	].join('&');
	return new URL(`${path}${query ? `?${query}` : ''}`, baseUrl);
}

/**
 * Percent-encoding that also writes a lone surrogate, as a careless client's UTF-8 encoder
 * does (three bytes, ED A0 80 for U+D800), where encodeURIComponent throws.
 */
function percentEncoded(text: string): string {
	return Array.from(text, (char) => {
		const unit = char.charCodeAt(0);
		if (char.length > 1 || unit < 0xd800 || unit > 0xdfff) return encodeURIComponent(char);
		return [0xe0 | (unit >> 12), 0x80 | ((unit >> 6) & 0x3f), 0x80 | (unit & 0x3f)]
			.map((byte) => `%${byte.toString(16).toUpperCase()}`)
			.join('');
	}).join('');
}

export async function execute(
	target: Target,
	request: FuzzRequest,
	baseUrl: string,
	sessions: Sessions
): Promise<Exchange> {
	const { bytes, mediaType } = await encode(request.body);
	const headers: Record<string, string> = { accept: request.accept, origin: baseUrl };
	if (sessions[request.actor]) headers.cookie = sessions[request.actor];
	if (request.ifMatch !== undefined) headers['if-match'] = request.ifMatch;
	const contentType = request.contentType === 'own' ? mediaType : request.contentType;
	if (contentType !== null && contentType !== 'none') headers['content-type'] = contentType;
	const method =
		target.kind === 'endpoint' ? target.method : target.kind === 'action' ? 'POST' : 'GET';
	const sent = await send(addressOf(target, request, baseUrl), { method, headers, body: bytes });
	if (sent.status <= 0) await awaitRecovery(baseUrl);
	const problem =
		target.kind === 'action'
			? actionProblem(sent, sent.mediaType === 'application/json')
			: target.routeId.startsWith('/api/')
				? apiProblem(sent)
				: pageProblem(sent);
	return {
		target: targetName(target),
		request: fc.stringify(request).slice(0, 400),
		status: sent.status,
		ms: sent.ms,
		problem: problem && `${problem}: ${sent.text.slice(0, 200)}`
	};
}
