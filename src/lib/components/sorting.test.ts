import { describe, expect, it } from 'vitest';
import { compareValues } from './sorting.svelte';

describe('compareValues', () => {
	it('orders numbers, dates and text the way a reader expects', () => {
		expect([10, 2, 33].sort(compareValues)).toEqual([2, 10, 33]);
		expect(['Tunnel 10', 'tunnel 2', 'Tunnel 1'].sort(compareValues)).toEqual([
			'Tunnel 1',
			'tunnel 2',
			'Tunnel 10'
		]);
		expect(
			[new Date(2026, 1, 1), new Date(2025, 1, 1)].sort(compareValues).map((d) => d.getFullYear())
		).toEqual([2025, 2026]);
		expect([null, 0.4, undefined, 0.3].sort(compareValues)).toEqual([0.3, 0.4, null, undefined]);
	});
});
