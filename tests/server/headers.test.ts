import { describe, expect, it } from 'vitest';
import { withHeaders } from '../../src/lib/server/api';

describe('withHeaders', () => {
	it('adds headers to a redirect whose headers are immutable instead of failing', () => {
		// Response.redirect's headers are immutable (Fetch standard, "redirect(url, status)").
		const redirect = Response.redirect('https://tunnel.example.org/signin?code=credentials', 302);
		expect(() => redirect.headers.set('x-test', '1')).toThrow(TypeError);
		const answered = withHeaders(redirect, { 'x-content-type-options': 'nosniff' });
		expect(answered.status).toBe(302);
		expect(answered.headers.get('location')).toBe(
			'https://tunnel.example.org/signin?code=credentials'
		);
		expect(answered.headers.get('x-content-type-options')).toBe('nosniff');
	});

	it('keeps a header the response set itself', () => {
		const own = new Response('x', { headers: { 'x-frame-options': 'SAMEORIGIN' } });
		expect(withHeaders(own, { 'x-frame-options': 'DENY' }).headers.get('x-frame-options')).toBe(
			'SAMEORIGIN'
		);
	});
});
