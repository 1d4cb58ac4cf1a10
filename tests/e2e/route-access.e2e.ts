/**
 * Walks the access table (route-access-table.ts) against the built app: every page, form action
 * and API method, called by every kind of caller, with requests that change nothing when
 * allowed. A refused caller gets 401, 403 or 404 (a signed-out visitor of a page is sent to
 * sign-in) and never sees the record; an allowed one is never refused, whatever its body.
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, type ExpectStatic } from 'vitest';
import { startSeededApp, type RunningApp } from '../../scripts/app-server';
import {
	DEMO_ACCOUNTS,
	DEMO_BILLING,
	DEMO_BOOKING,
	DEMO_CAMPAIGNS,
	DEMO_MODELS,
	DEMO_READINGS,
	DEMO_REVIEW_STORY
} from '../../scripts/demo-scenario';
import { postAction, send, signInCookie, type Answer, type Credential } from './http-session';
import { addTestCheckoutSession } from './test-checkout-session';
import {
	ACCESS_TABLE,
	CALLERS,
	RECORDS,
	type AccessLine,
	type Caller,
	type RecordName
} from './route-access-table';

const ROUTES_DIR = 'src/routes';

function routeFiles(dir: string): string[] {
	return readdirSync(dir, { withFileTypes: true }).flatMap((entry) => {
		const path = join(dir, entry.name);
		if (entry.isDirectory()) return routeFiles(path);
		return entry.name === '+page.server.ts' || entry.name === '+server.ts' ? [path] : [];
	});
}

/** The route id SvelteKit gives the folder of a route file: `/(app)/campaigns/[id]`. */
function routeId(file: string): string {
	const folder = file.slice(ROUTES_DIR.length).split(/[\\/]/).slice(0, -1).join('/');
	return folder || '/';
}

/** Skips a quoted string or template starting at `at`; answers the index of its closing quote. */
function skipString(source: string, at: number): number {
	const quote = source[at];
	let i = at + 1;
	while (i < source.length && source[i] !== quote) i += source[i] === '\\' ? 2 : 1;
	return i;
}

/**
 * The property names of `export const actions = { … }`, read at the object's top level; nested
 * objects, calls and strings are stepped over.
 */
function actionNames(source: string): string[] {
	const declared = source.search(/export\s+const\s+actions\b/);
	if (declared < 0) return [];
	const open = source.indexOf('{', source.indexOf('=', declared));
	const names: string[] = [];
	let depth = 0;
	let atKey = false;
	for (let i = open; i < source.length; i++) {
		const ch = source[i]!;
		if (ch === '/' && source[i + 1] === '/') i = source.indexOf('\n', i);
		else if (ch === '/' && source[i + 1] === '*') i = source.indexOf('*/', i) + 1;
		else if (ch === '"' || ch === "'" || ch === '`') {
			const end = skipString(source, i);
			if (depth === 1 && atKey) names.push(source.slice(i + 1, end));
			atKey = false;
			i = end;
		} else if ('{(['.includes(ch)) {
			depth++;
			atKey = depth === 1;
		} else if ('})]'.includes(ch)) {
			if (--depth === 0) break;
		} else if (depth === 1 && ch === ',') atKey = true;
		else if (depth === 1 && atKey && /[A-Za-z_$]/.test(ch)) {
			// `async name() {}` is a method too: its name is the word after `async`.
			const word = /^(?:async\s+)?([\w$]+)/.exec(source.slice(i))!;
			names.push(word[1]!);
			atKey = false;
			i += word[0].length - 1;
		}
	}
	return names;
}

const EXPORTED = /export\s+(?:const|let|function|async\s+function)\s+([\w$]+)/g;
const HTTP_METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS', 'fallback'];

/** Every `route call` the route files declare: each load, form action and request handler. */
function declaredCalls(): string[] {
	return routeFiles(ROUTES_DIR).flatMap((file) => {
		const source = readFileSync(file, 'utf8');
		const exported = [...source.matchAll(EXPORTED)].map((m) => m[1]!);
		const route = routeId(file);
		if (file.endsWith('+server.ts'))
			return exported.filter((name) => HTTP_METHODS.includes(name)).map((m) => `${route} ${m}`);
		return [
			...(exported.includes('load') ? [`${route} load`] : []),
			...actionNames(source).map((name) => `${route} action:${name}`)
		];
	});
}

describe('the access table', () => {
	it('lists every page load, form action and API method of the app, and nothing else', () => {
		const listed = new Set(ACCESS_TABLE.map((l) => `${l.route} ${l.call}`));
		const declared = new Set(declaredCalls());
		expect(declared.size).toBeGreaterThan(50);
		expect([...declared].filter((c) => !listed.has(c)).sort(), 'not in the table').toEqual([]);
		expect([...listed].filter((c) => !declared.has(c)).sort(), 'no longer in src/routes').toEqual(
			[]
		);
	});

	it('finds actions written in every way an actions object allows', () => {
		const source = `export const actions: Actions = {
			// a comment: not: an action
			first: async ({ request }) => { const x = { nested: 1 }; return fail(400, { x }); },
			'quoted-name': () => ({ text: "a, b: c" }),
			async method() { return { deep: [1, { deeper: 2 }] }; },
			default: signOut
		};`;
		expect(actionNames(source)).toEqual(['first', 'quoted-name', 'method', 'default']);
		expect(actionNames('export const actions = { default: signOut };')).toEqual(['default']);
	});
});

const TEAM_AERODYNAMICIST = {
	Alder: 'aero@demo.test',
	Brightwater: 'aero2@demo.test'
} as const;
type Team = keyof typeof TEAM_AERODYNAMICIST;
const OTHER_TEAM: Record<Team, Team> = { Alder: 'Brightwater', Brightwater: 'Alder' };
const STAFF_ACCOUNT = {
	reviewer: 'reviewer@demo.test',
	operator: 'operator@demo.test',
	admin: 'admin@demo.test'
} as const;

let app: RunningApp;
const cookies = new Map<string, string>();
const tokens = new Map<Team, string>();
/** Ids of the table's records and the other values its paths name. */
const values = new Map<string, string>();
/** What each record is known by; a refused caller must see none of it. */
const secrets = new Map<RecordName, string[]>();
const findings: string[] = [];

const session = (email: string): Credential => ({ cookie: cookies.get(email)! });

async function getJson<T>(credential: Credential, path: string): Promise<T> {
	const answer = await send(app.baseUrl, credential, 'GET', path, {
		headers: { accept: 'application/json' }
	});
	if (answer.status !== 200) throw new Error(`GET ${path}: ${answer.status} ${answer.body}`);
	return JSON.parse(answer.body) as T;
}

async function postJson<T>(credential: Credential, path: string, body: unknown): Promise<T> {
	const answer = await send(app.baseUrl, credential, 'POST', path, {
		body: JSON.stringify(body),
		headers: { accept: 'application/json', 'content-type': 'application/json' }
	});
	if (answer.status !== 201) throw new Error(`POST ${path}: ${answer.status} ${answer.body}`);
	return JSON.parse(answer.body) as T;
}

function found<T>(what: string, value: T | undefined | null): T {
	if (value === undefined || value === null) throw new Error(`The demo has no ${what}.`);
	return value;
}

type Named = { id: string; name: string };

/** The four demo campaigns, one in each state the table needs, and two spare drafts to delete. */
async function prepareCampaigns(owner: Credential, admin: Credential) {
	const { campaigns } = await getJson<{ campaigns: Named[] }>(admin, '/api/v1/campaigns');
	const storyOf = (verdict: string | undefined) =>
		DEMO_REVIEW_STORY.find((s) => s.decision?.verdict === verdict)?.campaign;
	const named = {
		inReview: storyOf(undefined),
		returned: storyOf('return'),
		approved: storyOf('approve'),
		unsubmitted: DEMO_CAMPAIGNS.map((c) => c.input.name).find(
			(n) => !DEMO_REVIEW_STORY.some((s) => s.campaign === n)
		)
	} as const;
	for (const [record, name] of Object.entries(named)) {
		const known = found(`${record} campaign`, name);
		values.set(
			record,
			found(
				known,
				campaigns.find((c) => c.name === known)
			).id
		);
		secrets.set(record as RecordName, [known]);
	}

	const resource = await getJson<Record<string, unknown>>(
		owner,
		`/api/v1/campaigns/${values.get('returned')}`
	);
	for (const record of ['scratchPage', 'scratchApi'] as const) {
		const name = `Spare draft (${record})`;
		const made = await postJson<{ id: string }>(owner, '/api/v1/campaigns', { ...resource, name });
		values.set(record, made.id);
		secrets.set(record, [name]);
	}

	const approvedId = values.get('approved')!;
	const page = await send(
		app.baseUrl,
		session(TEAM_AERODYNAMICIST.Brightwater),
		'GET',
		`/campaigns/${approvedId}`
	);
	const upload = new RegExp(`/campaigns/${approvedId}/readings/([\\w-]+)"`).exec(page.body);
	values.set('upload', found('readings file', upload?.[1]));
	secrets.set('upload', [DEMO_READINGS.fileName, DEMO_READINGS.campaign]);
}

/** The team's first model, with a drawing attached so the attachment route has one to serve. */
async function prepareModel(owner: Credential, admin: Credential) {
	const modelName = DEMO_MODELS[0]!.model.name;
	const { models } = await getJson<{ models: Named[] }>(admin, '/api/v1/models');
	const modelId = found(
		modelName,
		models.find((m) => m.name === modelName)
	).id;
	values.set('model', modelId);
	secrets.set('model', [modelName]);

	const attachmentName = 'rear-wing-section.svg';
	const file = new FormData();
	const drawing = '<svg xmlns="http://www.w3.org/2000/svg" width="4" height="2"><rect/></svg>';
	file.set('file', new Blob([drawing], { type: 'image/svg+xml' }), attachmentName);
	const attached = await postAction(app.baseUrl, owner, `/models/${modelId}`, 'attach', file);
	if (attached.status !== 200) throw new Error(`Attaching a drawing: ${attached.status}`);
	const { attachments } = await getJson<{ attachments: { id: string }[] }>(
		owner,
		`/api/v1/models/${modelId}`
	);
	values.set('attachment', found('attachment', attachments[0]).id);
	secrets.set('attachment', [attachmentName, modelName]);
}

/** `YYYY-MM-DD` of an instant in a time zone, as the calendar's `?week=` takes it. */
function localDate(instant: Date, timeZone: string): string {
	const parts = new Intl.DateTimeFormat('en', {
		timeZone,
		year: 'numeric',
		month: '2-digit',
		day: '2-digit'
	}).formatToParts(instant);
	const part = (type: string) => parts.find((p) => p.type === type)!.value;
	return `${part('year')}-${part('month')}-${part('day')}`;
}

/** The booked facility and one slot of the approved campaign, with the week it falls in. */
async function prepareBooking(operator: Credential) {
	const { facilities } = await getJson<{ facilities: (Named & { timeZone: string })[] }>(
		operator,
		'/api/v1/facilities'
	);
	const facility = found(
		DEMO_BOOKING.facility,
		facilities.find((f) => f.name === DEMO_BOOKING.facility)
	);
	values.set('facility', facility.id);
	secrets.set('facility', []);

	const day_ms = 86_400_000;
	values.set('rangeFrom', new Date(Date.now() - day_ms).toISOString());
	values.set('rangeTo', new Date(Date.now() + 60 * day_ms).toISOString());
	const { bookings } = await getJson<{
		bookings: (Named & { start: string; campaignName: string })[];
	}>(
		operator,
		`/api/v1/facilities/${facility.id}/bookings?from=${values.get('rangeFrom')}&to=${values.get('rangeTo')}`
	);
	const slot = found(
		'booking',
		bookings.find((b) => b.campaignName === DEMO_BOOKING.campaign)
	);
	values.set('booking', slot.id);
	values.set('bookingDay', localDate(new Date(slot.start), facility.timeZone));
	secrets.set('booking', [DEMO_BOOKING.campaign]);
}

/** The approved campaign's quote and invoice, which the demo issues. */
async function prepareBilling(operator: Credential) {
	const campaignId = values.get('approved')!;
	const q = await getJson<{ id: string }>(operator, `/api/v1/campaigns/${campaignId}/quote`);
	values.set('quote', q.id);
	secrets.set('quote', [DEMO_BILLING.campaign]);
	const { invoices } = await getJson<{ invoices: { id: string }[] }>(
		operator,
		`/api/v1/invoices?campaign=${campaignId}`
	);
	values.set('invoice', found('invoice', invoices[0]).id);
	secrets.set('invoice', [DEMO_BILLING.campaign]);
}

/** The secrets the app shows once: API tokens, a calendar feed address, an invitation link. */
async function prepareSecrets(owner: Credential, admin: Credential, operator: Credential) {
	const everyScope = ['readings:write', 'readings:read', 'campaigns:read'];
	for (const team of ['Alder', 'Brightwater'] as const) {
		const made = await postJson<{ token: string }>(
			session(TEAM_AERODYNAMICIST[team]),
			'/api/v1/tokens',
			{ name: 'Tunnel acquisition computer', scopes: everyScope }
		);
		tokens.set(team, made.token);
	}
	const spareName = 'Spare token to revoke';
	const spare = await postJson<{ id: string }>(owner, '/api/v1/tokens', {
		name: spareName,
		scopes: ['readings:read']
	});
	values.set('apiToken', spare.id);
	secrets.set('apiToken', [spareName]);

	const rotated = await postAction(app.baseUrl, operator, '/calendar-feed', 'rotate');
	const feed = /\/calendar\/([^"\\/]+)\.ics/.exec(rotated.body)?.[1];
	values.set('calendarFeed', found('calendar feed', feed));
	secrets.set('calendarFeed', []);

	const { teams } = await getJson<{ teams: Named[] }>(owner, '/api/v1/me');
	const invited = await postAction(
		app.baseUrl,
		admin,
		'/admin',
		'invite',
		new URLSearchParams([
			['email', 'new.colleague@demo.test'],
			['name', 'New Colleague'],
			['roles', 'aerodynamicist'],
			['teamIds', found('team', teams[0]).id]
		])
	);
	values.set('invitation', found('invitation', /\/invitation\/([\w-]+)/.exec(invited.body)?.[1]));
	secrets.set('invitation', []);

	values.set('checkoutSession', addTestCheckoutSession(app.databasePath, app.baseUrl));
	secrets.set('checkoutSession', []);
}

/** Finds or makes every record the table points at, through the app's own pages and API. */
async function prepareRecords() {
	await Promise.all(
		DEMO_ACCOUNTS.map(async ({ email }) =>
			cookies.set(email, await signInCookie(app.baseUrl, email))
		)
	);
	const owner = session(TEAM_AERODYNAMICIST.Alder);
	const admin = session(STAFF_ACCOUNT.admin);
	const operator = session(STAFF_ACCOUNT.operator);
	await Promise.all([
		prepareCampaigns(owner, admin).then(() => prepareBilling(operator)),
		prepareModel(owner, admin),
		prepareBooking(operator),
		prepareSecrets(owner, admin, operator)
	]);
}

const PLACEHOLDER = /\{(\w+)\}/g;

function lineRecord(line: AccessLine): RecordName | undefined {
	if (line.record) return line.record;
	const first = [...line.path.matchAll(PLACEHOLDER)].map((m) => m[1]!).find((n) => n in RECORDS);
	return first as RecordName | undefined;
}

function credentialFor(caller: Caller, team: Team): Credential {
	switch (caller) {
		case 'anonymous':
			return {};
		case 'owner':
			return session(TEAM_AERODYNAMICIST[team]);
		case 'otherTeam':
			return session(TEAM_AERODYNAMICIST[OTHER_TEAM[team]]);
		case 'token':
			return { bearer: tokens.get(team)! };
		default:
			return session(STAFF_ACCOUNT[caller]);
	}
}

function call(line: AccessLine, credential: Credential): Promise<Answer> {
	const fill = (text: string, encode: (v: string) => string) =>
		text.replace(PLACEHOLDER, (_, name: string) =>
			encode(found(`value for {${name}}`, values.get(name)))
		);
	const path = fill(line.path, encodeURIComponent);
	const base = app.baseUrl;
	if (line.call === 'load')
		return send(base, credential, 'GET', path, { headers: { accept: 'text/html' } });
	if (line.call.startsWith('action:')) {
		const name = line.call.slice('action:'.length);
		return postAction(
			base,
			credential,
			path,
			name === 'default' ? null : name,
			new URLSearchParams(Object.entries(line.form ?? {}).map(([k, v]) => [k, fill(v, (x) => x)]))
		);
	}
	if (line.call === 'GET' || line.call === 'DELETE')
		return send(base, credential, line.call, path, { headers: { accept: 'application/json' } });
	const csv = line.csv !== undefined;
	return send(base, credential, line.call, path, {
		body: csv ? line.csv : (line.json ?? '{}'),
		headers: { accept: 'application/json', 'content-type': csv ? 'text/csv' : 'application/json' }
	});
}

const REFUSALS = [401, 403, 404];

/** What is wrong with `answer` for `caller` on `line`, or null when it is as the table says. */
function problem(line: AccessLine, caller: Caller, answer: Answer): string | null {
	const { status } = answer;
	const record = lineRecord(line);
	const shown = (record ? secrets.get(record)! : []).find((s) => answer.body.includes(s));
	const toSignIn = status === 303 && (answer.location ?? '').startsWith('/signin');
	if (line.allow.includes(caller)) {
		if (status >= 500 || REFUSALS.includes(status) || toSignIn)
			return `allowed, expected no refusal, got ${status}${toSignIn ? ' to /signin' : ''}`;
		if (line.conceal?.includes(caller) && shown) return `allowed, but the answer shows "${shown}"`;
		return null;
	}
	const signInPage = caller === 'anonymous' && !line.route.startsWith('/api/');
	if (signInPage ? !toSignIn : !REFUSALS.includes(status))
		return `refused, expected ${signInPage ? '303 to /signin' : '401/403/404'}, got ${status}${answer.location ? ` to ${answer.location}` : ''}`;
	if (shown) return `refused with ${status}, but the answer shows "${shown}"`;
	return null;
}

async function check(line: AccessLine, expect: ExpectStatic) {
	const record = lineRecord(line);
	// A record without a team, or none, is judged as if Alder Motorsport's.
	const team: Team = (record && RECORDS[record]) || 'Alder';
	const run = async (caller: Caller) => {
		const answer = await call(line, credentialFor(caller, team));
		return { caller, answer, wrong: problem(line, caller, answer) };
	};
	const refused = CALLERS.filter((c) => !line.allow.includes(c));
	const allowed = CALLERS.filter((c) => line.allow.includes(c));
	let outcomes: Awaited<ReturnType<typeof run>>[];
	if (line.changes) {
		// Refusals first, so the allowed call that changes the record comes after them.
		outcomes = await Promise.all(refused.map(run));
		for (const caller of allowed) outcomes.push(await run(caller));
	} else {
		outcomes = await Promise.all(CALLERS.map(run));
	}
	const wrong = outcomes.flatMap(({ caller, wrong }) =>
		wrong ? [`${line.call} ${line.path} as ${caller}: ${wrong}`] : []
	);
	findings.push(...wrong);
	expect(wrong).toEqual([]);
	if (line.conceal) {
		// The concealment check can fail: a caller entitled to the record does see its name.
		const secret = secrets.get(lineRecord(line)!)![0]!;
		const entitled = outcomes.filter(
			({ caller }) => allowed.includes(caller) && !line.conceal!.includes(caller)
		);
		expect(entitled.some(({ answer }) => answer.body.includes(secret))).toBe(true);
	}
}

describe('every route answers each caller as the access table says', () => {
	beforeAll(async () => {
		app = await startSeededApp({ quiet: true });
		await prepareRecords();
	});
	afterAll(async () => {
		if (findings.length) console.log(`Access findings:\n${findings.join('\n')}`);
		await app?.stop();
	});

	const cases = (lines: AccessLine[]) =>
		lines.map((line) => [`${line.call} ${line.path}`, line] as const);
	describe.concurrent('reading, or writing nothing', () => {
		it.for(cases(ACCESS_TABLE.filter((l) => !l.changes)))('%s', ([, line], { expect }) =>
			check(line, expect)
		);
	});
	// In table order, after everything else: signing out, at the end, ends the sessions.
	describe.sequential('changing something when allowed', () => {
		it.for(cases(ACCESS_TABLE.filter((l) => l.changes)))('%s', ([, line], { expect }) =>
			check(line, expect)
		);
	});
});
