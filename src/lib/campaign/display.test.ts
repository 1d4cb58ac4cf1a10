import { describe, expect, it } from 'vitest';
import { formatDuration, formatRe } from './display';

describe('display formats', () => {
	it.each([
		[1534000, '1.53e6'],
		[999600, '1.00e6'],
		[27000, '2.70e4'],
		[0, '0']
	])('formatRe(%d) = %s', (re, text) => {
		expect(formatRe(re)).toBe(text);
	});

	it.each([
		[0, '0 min'],
		[2700, '45 min'],
		[3600 * 37 + 300, '37 h 05 min'],
		[3599.9, '1 h 00 min']
	])('formatDuration(%d) = %s', (s, text) => {
		expect(formatDuration(s)).toBe(text);
	});
});
