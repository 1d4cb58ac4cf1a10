import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { CalcInputError, occupancyCost, toSignificant } from './index';

describe('occupancy cost', () => {
	it('is hours × rate to the cent, in decimal arithmetic', () => {
		// decimal.js as the reference: 10 h 20 min at 780.00 per hour.
		expect(occupancyCost(37200, '780.00')).toBe(
			new Decimal(37200).div(3600).mul('780.00').toFixed(2)
		);
		expect(occupancyCost(37200, '780.00')).toBe('8060.00');
		// 0.1 + 0.2 in binary floating point is 0.30000000000000004; in decimals it is exact.
		expect(occupancyCost(3600, '0.1')).toBe('0.10');
		expect(occupancyCost(1, '3600.005')).toBe('1.00');
	});

	it.each(['abc', '-5', 'Infinity'])('refuses the rate %s', (rate) => {
		expect(() => occupancyCost(3600, rate)).toThrow(CalcInputError);
	});
});

describe('toSignificant', () => {
	it('rounds to significant figures without binary noise', () => {
		expect(toSignificant(0.1 + 0.2, 4)).toBe('0.3');
		expect(toSignificant(7531234.5, 3)).toBe('7530000');
		expect(toSignificant(0.000123456, 3)).toBe('0.000123');
	});
});
