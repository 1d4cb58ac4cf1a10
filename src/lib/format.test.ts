import { describe, expect, it } from 'vitest';
import { money } from './format';

describe('money', () => {
	it('groups an amount to its currency’s minor unit', () => {
		// ISO 4217 minor units: EUR 2, JPY 0, BHD 3.
		expect(money('11733.4', 'EUR')).toBe('11,733.40 EUR');
		expect(money('150000', 'JPY')).toBe('150,000 JPY');
		expect(money('12.5', 'BHD')).toBe('12.500 BHD');
	});

	it('writes a credit with the minus sign, not a hyphen', () => {
		// The Unicode Standard, U+2212 MINUS SIGN: the sign of arithmetic, as distinct from U+002D.
		expect(money('-2713.2', 'EUR')).toBe('\u22122,713.20 EUR');
		expect(money('0.00', 'EUR')).toBe('0.00 EUR');
	});

	it('keeps every digit of an amount beyond a binary float’s precision', () => {
		// 2^53 + 1 is the first integer an IEEE 754 double cannot hold (IEEE 754-2008, binary64).
		expect(money('9007199254740993.01', 'EUR')).toBe('9,007,199,254,740,993.01 EUR');
	});
});
