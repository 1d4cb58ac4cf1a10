import { describe, expect, it } from 'vitest';
import { sameOriginPath } from './redirect';

const ORIGIN = 'https://tunnel.example.org';

describe('sameOriginPath', () => {
	it.each([
		'https://elsewhere.example',
		'//elsewhere.example',
		'/\t/elsewhere.example',
		'/\\elsewhere.example',
		'\\\\elsewhere.example',
		'javascript:alert(1)',
		'http://tunnel.example.org/campaigns'
	])('refuses %j', (candidate) => {
		expect(sameOriginPath(candidate, ORIGIN)).toBeNull();
	});

	it('keeps a path of the app with its query and fragment', () => {
		expect(sameOriginPath('/campaigns/abc?tab=readings#coverage', ORIGIN)).toBe(
			'/campaigns/abc?tab=readings#coverage'
		);
		expect(sameOriginPath(`${ORIGIN}/review`, ORIGIN)).toBe('/review');
		expect(sameOriginPath(undefined, ORIGIN)).toBeNull();
	});
});
