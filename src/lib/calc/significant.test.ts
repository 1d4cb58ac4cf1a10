import { describe, expect, it } from 'vitest';
import { toSignificant } from './index';

describe('toSignificant', () => {
	it('rounds to significant figures without binary noise', () => {
		expect(toSignificant(0.1 + 0.2, 4)).toBe('0.3');
		expect(toSignificant(7531234.5, 3)).toBe('7530000');
		expect(toSignificant(0.000123456, 3)).toBe('0.000123');
	});
});
