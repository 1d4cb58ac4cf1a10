import { describe, expect, it } from 'vitest';
import { speedList } from './finding-groups';

describe('speed lists in findings', () => {
	it('lists a few speeds in full and a long sweep as a range', () => {
		expect(speedList([20])).toBe('20 m/s');
		expect(speedList([25, 20])).toBe('20 and 25 m/s');
		expect(speedList([20, 25, 30])).toBe('20, 25 and 30 m/s');
		expect(speedList([15, 20, 25, 30, 35])).toBe('15–35 m/s (5 speeds)');
	});
});
