import { describe, expect, it } from 'vitest';
import { DEMO_READINGS } from '../../scripts/demo-scenario';
import { READINGS_MAX_BYTES } from '../../src/lib/schemas/readings';
import { ownOrigin, postCredentials, sessionCookie, url } from './browser';

describe('sign-in cannot be turned against the user', () => {
	it('answers a wrong password posted straight to the credentials endpoint with the refusal, not 500', async () => {
		for (const email of ['aero@demo.test', 'nobody@demo.test']) {
			const answer = await postCredentials(email, 'not-the-password');
			expect(answer.status).toBeLessThan(500);
			expect(answer.headers.get('location') ?? '').toMatch(/code=credentials/);
		}
	});

	it('sends a signed-in user only to paths of the app', async () => {
		const origin = new URL(url('/')).origin;
		const cookie = await sessionCookie('reviewer@demo.test');
		for (const target of [
			'https://elsewhere.example',
			'//elsewhere.example',
			'/\t/elsewhere.example'
		]) {
			const answer = await fetch(url(`/signin?redirectTo=${encodeURIComponent(target)}`), {
				redirect: 'manual',
				headers: { cookie }
			});
			expect(answer.status).toBe(303);
			expect(new URL(answer.headers.get('location')!, origin).origin).toBe(origin);
		}
	});
});

describe('the production start', () => {
	const SHARED = [
		'x-content-type-options',
		'referrer-policy',
		'x-frame-options',
		'cross-origin-opener-policy',
		'permissions-policy',
		'content-security-policy'
	];

	it('puts the security headers on pages, API answers and static files alike', async () => {
		for (const path of ['/signin', '/api/v1/me', '/favicon.svg', '/no-such-page']) {
			const answer = await fetch(url(path), { redirect: 'manual' });
			for (const name of SHARED)
				expect(answer.headers.get(name), `${name} on ${path}`).toBeTruthy();
			// The app is served over http here, where HSTS would be meaningless.
			expect(answer.headers.get('strict-transport-security')).toBeNull();
		}
		const page = await fetch(url('/signin'));
		const csp = page.headers.get('content-security-policy')!;
		const scripts = csp.split(';').find((d) => d.trim().startsWith('script-src'))!;
		expect(scripts).toMatch(/'nonce-[^']+'/);
		expect(scripts).not.toContain('unsafe-inline');
		const nonce = /'nonce-([^']+)'/.exec(scripts)![1]!;
		// Every inline script the page carries is one the policy lets run.
		const body = await page.text();
		const inline = [...body.matchAll(/<script(?![^>]*\ssrc=)([^>]*)>/g)].map((m) => m[1]);
		expect(inline.length).toBeGreaterThan(0);
		for (const attributes of inline) expect(attributes).toContain(`nonce="${nonce}"`);
	});

	it('reads bodies up to the upload limit and refuses larger ones with the structured error', async () => {
		const cookie = await sessionCookie('operator@demo.test');
		const campaigns = await (await fetch(url('/api/v1/campaigns'), { headers: { cookie } })).json();
		const id = campaigns.campaigns.find(
			(c: { name: string }) => c.name === DEMO_READINGS.campaign
		).id;
		const send = (body: string) =>
			fetch(url(`/api/v1/campaigns/${id}/readings`), {
				method: 'POST',
				headers: { cookie, 'content-type': 'text/csv', origin: new URL(url('/')).origin },
				body
			});
		// 2 MB, four times adapter-node's default limit: read and refused for its content.
		const rows = 'point,kind,value\n' + 'nowhere,pressure,1\n'.repeat(110_000);
		const read = await send(rows);
		expect(read.status).toBe(400);
		expect((await read.json()).error.code).toBeTruthy();

		const over = await send('x'.repeat(READINGS_MAX_BYTES + 1));
		expect(over.status).toBe(413);
		expect((await over.json()).error).toMatchObject({ code: 'too-large' });
	});
});

describe('sessions', () => {
	it('ends the session on the server at sign-out, so a copied cookie stops working', async () => {
		const cookie = await sessionCookie('reviewer@demo.test');
		const me = () => fetch(url('/api/v1/me'), { headers: { cookie } });
		expect((await me()).status).toBe(200);
		const signedOut = await fetch(url('/signout'), {
			method: 'POST',
			redirect: 'manual',
			headers: {
				cookie,
				'content-type': 'application/x-www-form-urlencoded',
				origin: new URL(url('/')).origin
			},
			body: ''
		});
		expect(signedOut.status).toBeLessThan(400);
		// The same cookie, replayed as a thief would after the owner signed out.
		expect((await me()).status).toBe(401);
	});

	it('leaves a fresh session cookie as it is instead of re-issuing it with every answer', async () => {
		const cookie = await sessionCookie('reviewer@demo.test');
		for (const path of ['/api/v1/me', '/campaigns']) {
			const answer = await fetch(url(path), { headers: { cookie } });
			expect(answer.status, path).toBe(200);
			expect(answer.headers.getSetCookie(), path).toEqual([]);
		}
	});

	it('answers the readiness check without a session, and ignores a bad one', async () => {
		const sent: Record<string, string>[] = [{}, { cookie: 'authjs.session-token=not-a-token' }];
		for (const headers of sent) {
			const answer = await fetch(url('/healthz'), { headers });
			expect(answer.status).toBe(200);
			expect(await answer.json()).toEqual({ status: 'ok' });
			expect(answer.headers.getSetCookie()).toEqual([]);
		}
	});
});

describe('cookie-signed API writes', () => {
	it('are taken only from the app’s own origin; token calls need none', async () => {
		const cookie = await sessionCookie('aero@demo.test');
		const body = JSON.stringify({ model: 'isa', geopotentialAltitude: { value: 5, unit: 'km' } });
		const post = (headers: Record<string, string>) =>
			fetch(url('/api/v1/calc/atmosphere'), {
				method: 'POST',
				headers: { cookie, 'content-type': 'application/json', ...headers },
				body
			});
		const foreignOrigins: Record<string, string>[] = [{}, { origin: 'https://elsewhere.example' }];
		for (const foreign of foreignOrigins) {
			const refused = await post(foreign);
			expect(refused.status).toBe(403);
			expect((await refused.json()).error.code).toBe('cross-origin');
		}
		expect((await post(ownOrigin())).status).toBe(200);
	});
});
