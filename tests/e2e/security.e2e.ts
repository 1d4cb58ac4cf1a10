import { describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../scripts/demo-scenario';
import { url } from './browser';

describe('sign-in cannot be turned against the user', () => {
	it('answers a wrong password posted straight to the credentials endpoint with the refusal, not 500', async () => {
		for (const email of ['aero@demo.test', 'nobody@demo.test']) {
			const answer = await fetch(url('/auth/callback/credentials'), {
				method: 'POST',
				redirect: 'manual',
				headers: {
					'content-type': 'application/x-www-form-urlencoded',
					origin: new URL(url('/')).origin
				},
				body: new URLSearchParams({ email, password: 'not-the-password' })
			});
			expect(answer.status).toBeLessThan(500);
			expect(answer.headers.get('location') ?? '').toMatch(/code=credentials/);
		}
	});

	it('sends a signed-in user only to paths of the app', async () => {
		const origin = new URL(url('/')).origin;
		const signIn = await fetch(url('/auth/callback/credentials'), {
			method: 'POST',
			redirect: 'manual',
			headers: { 'content-type': 'application/x-www-form-urlencoded', origin },
			body: new URLSearchParams({ email: 'reviewer@demo.test', password: DEMO_PASSWORD })
		});
		const cookie = signIn.headers
			.getSetCookie()
			.map((c) => c.split(';')[0])
			.join('; ');
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
