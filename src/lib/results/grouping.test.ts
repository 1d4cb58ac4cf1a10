import { describe, expect, it } from 'vitest';
import { groupBy } from './grouping';

describe('groupBy', () => {
	it('keeps groups in the order their first item comes, and items in their order', () => {
		const runs = [
			{ run: 1, plane: 'far' },
			{ run: 2, plane: 'near' },
			{ run: 3, plane: 'far' }
		];
		expect(groupBy(runs, (r) => r.plane).map((g) => g.map((r) => r.run))).toEqual([[1, 3], [2]]);
		expect(groupBy([], String)).toEqual([]);
	});
});
