/**
 * Benchmark of the built server over loopback HTTP with autocannon, at 32 connections: requests
 * per second and the 99th percentile latency of a signed-in JSON read (`GET /api/v1/me`), a
 * calculation (`POST /api/v1/calc/similarity`), the campaigns list page and a 500-row page of
 * the 54 000-point campaign's matrix, each beside `/healthz` (a database query and no session
 * work) measured in the same round, which is the floor: what the server, SvelteKit and the
 * hooks cost before any route does its own work. Rounds alternate the routes, so the machine's
 * slow spells spread over all of them; figures are the median of `BENCH_RUNS` rounds (at least
 * 3) with min–max. Any answer that is not 2xx fails the run: a refused request is fast and
 * would pass for a quick one.
 */
import autocannon from 'autocannon';
import { signInCookie } from '../tests/e2e/http-session';
import { startSeededApp } from './app-server';

const RUNS = Math.max(3, Number(process.env.BENCH_RUNS ?? 3));
const SECONDS = Math.max(2, Number(process.env.BENCH_SECONDS ?? 5));
const CONNECTIONS = 32;
const LARGE = 'AM-7 rear-wing wake survey';

type Route = {
	label: string;
	path: string;
	method?: 'GET' | 'POST';
	body?: string;
	signedIn: boolean;
};

type Sample = { requests_ps: number; p99_ms: number };

const median = (xs: number[]) => {
	const sorted = [...xs].sort((a, b) => a - b);
	const middle = sorted.length >> 1;
	return sorted.length % 2 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
};
const spread = (xs: number[], digits: number) =>
	`${median(xs).toFixed(digits)} (${Math.min(...xs).toFixed(digits)}–${Math.max(...xs).toFixed(digits)})`;

async function measure(
	baseUrl: string,
	route: Route,
	cookie: string,
	duration: number
): Promise<Sample> {
	const headers: Record<string, string> = { accept: 'application/json' };
	if (route.signedIn) headers.cookie = cookie;
	if (route.method === 'POST') {
		headers['content-type'] = 'application/json';
		headers.origin = new URL(baseUrl).origin;
	}
	if (route.path.startsWith('/campaigns')) headers.accept = 'text/html';
	const result = await autocannon({
		url: baseUrl + route.path,
		method: route.method ?? 'GET',
		headers,
		body: route.body,
		connections: CONNECTIONS,
		duration
	});
	const failed = result.non2xx + result.errors + result.timeouts;
	if (failed > 0)
		throw new Error(`${route.label}: ${failed} of ${result.requests.total} requests failed`);
	return { requests_ps: result.requests.average, p99_ms: result.latency.p99 };
}

const app = await startSeededApp({ quiet: true });
try {
	const cookie = await signInCookie(app.baseUrl, 'aero@demo.test');
	const listing = await fetch(`${app.baseUrl}/api/v1/campaigns`, { headers: { cookie } });
	const { campaigns } = (await listing.json()) as { campaigns: { id: string; name: string }[] };
	const large = campaigns.find((c) => c.name === LARGE);
	if (!large) throw new Error(`The demo has no campaign named ${LARGE}.`);

	const floor: Route = { label: 'GET /healthz', path: '/healthz', signedIn: false };
	const routes: Route[] = [
		{ label: 'GET /api/v1/me', path: '/api/v1/me', signedIn: true },
		{
			label: 'POST /api/v1/calc/similarity',
			path: '/api/v1/calc/similarity',
			method: 'POST',
			signedIn: true,
			body: JSON.stringify({
				scale: 0.25,
				fullScaleLength: 4,
				fullScaleSpeed: { value: 100, unit: 'km/h' },
				modelSpeed: 40,
				fullScaleAir: { model: 'isa', geopotentialAltitude: 0 },
				tunnelAir: { model: 'isa', geopotentialAltitude: 0 }
			})
		},
		{ label: 'GET /campaigns (page)', path: '/campaigns', signedIn: true },
		{
			label: 'GET matrix, 500 of 54 000 rows',
			path: `/api/v1/campaigns/${large.id}/matrix?offset=0&limit=500`,
			signedIn: true
		}
	];

	// One short pass first, so every route is compiled and its caches are warm.
	for (const route of [floor, ...routes]) await measure(app.baseUrl, route, cookie, 1);

	const samples = new Map<Route, Sample[]>([floor, ...routes].map((r) => [r, []]));
	const ratios = new Map<Route, number[]>(routes.map((r) => [r, []]));
	for (let run = 0; run < RUNS; run++) {
		const base = await measure(app.baseUrl, floor, cookie, SECONDS);
		samples.get(floor)!.push(base);
		for (const route of routes) {
			const sample = await measure(app.baseUrl, route, cookie, SECONDS);
			samples.get(route)!.push(sample);
			ratios.get(route)!.push(sample.requests_ps / base.requests_ps);
		}
	}

	console.log(
		`${CONNECTIONS} connections, ${SECONDS} s per route and round, ${RUNS} rounds: median (min–max)`
	);
	for (const [route, taken] of samples) {
		const rate = spread(
			taken.map((s) => s.requests_ps),
			0
		);
		const p99 = spread(
			taken.map((s) => s.p99_ms),
			0
		);
		const ratio = ratios.get(route);
		console.log(
			`${route.label.padEnd(32)} ${rate} req/s, p99 ${p99} ms` +
				(ratio ? `, ${spread(ratio, 2)} of /healthz` : ' (the floor)')
		);
	}
	console.log(
		'aim: signed-in JSON ≥ 0.5 of the floor, the list page ≥ 0.2, p99 < 25 ms for the JSON routes'
	);
} finally {
	await app.stop();
}
