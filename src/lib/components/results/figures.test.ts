import { describe, expect, it } from 'vitest';
import { decimalsFor, plusMinus, valueAndExpanded } from './figures';

describe('figures with expanded uncertainty', () => {
	it('shows U = k·u with k = 2, to as many decimals as U needs', () => {
		// JCGM 100:2008 §6.2.1 and §6.3.3: U = k·u, k = 2 for about 95 % coverage.
		expect(valueAndExpanded(-0.41234, 0.0021)).toEqual({ value: '-0.412', expanded: '0.004' });
		expect(decimalsFor(0.00012)).toBe(4);
		expect(valueAndExpanded(-0.41234, 0.00012)).toEqual({ value: '-0.4123', expanded: '0.0002' });
		expect(plusMinus(-0.41234, 0.0021)).toBe('-0.412 ± 0.004');
	});

	it('gives the value alone, and a dash for U, without an uncertainty', () => {
		expect(valueAndExpanded(1.5, null, 2)).toEqual({ value: '1.50', expanded: '—' });
		expect(plusMinus(1.5, undefined, 2)).toBe('1.50');
	});
});
