import { describe, expect, it } from 'vitest';
import { formatCompact } from './number-format';

describe('compact numbers', () => {
	it.each([
		[2.5e6, '2.5 M'],
		[30_000, '30 k'],
		[1.4e7, '14 M'],
		[385_000, '385 k'],
		[1_234_567, '1.23 M'],
		[999_950, '1 M'],
		[2.7e4, '27 k'],
		[3e9, '3 G'],
		[500, '500'],
		[0.5, '0.5'],
		[0, '0']
	])('writes %d as %s', (value, text) => {
		expect(formatCompact(value)).toBe(text);
	});
});
