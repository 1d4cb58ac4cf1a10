import { describe, expect, it } from 'vitest';
import { dotsPath, gridExtent, minSpacing, splitBySection } from './probe-points';

describe('probe grid', () => {
	const section = { width_m: 2, height_m: 1 };
	const grid = { y_m: [0, 0.5, 1.2], z_m: [-1, 0, 1.1] };

	it('gives the extent of rows and columns', () => {
		expect(gridExtent(grid)).toEqual({
			rows: 3,
			columns: 3,
			points: 9,
			y_m: [0, 1.2],
			z_m: [-1, 1.1]
		});
		expect(gridExtent({ y_m: [], z_m: [0.1] })).toEqual({
			rows: 0,
			columns: 1,
			points: 0,
			y_m: null,
			z_m: [0.1, 0.1]
		});
	});

	it('counts points beyond the ceiling and the side wall as outside, points on a wall as inside', () => {
		const { inside, outside } = splitBySection(grid, section);
		expect(outside).toHaveLength(5);
		expect(inside).toEqual([
			[-1, 0],
			[0, 0],
			[-1, 0.5],
			[0, 0.5]
		]);
		expect(outside).toContainEqual([1.1, 0]);
		expect(outside).toContainEqual([0, 1.2]);
	});

	it('finds the smallest spacing between distinct positions', () => {
		expect(minSpacing([0, 0.3, 0.1, 0.1])).toBeCloseTo(0.1, 12);
		expect(minSpacing([0.4])).toBeNull();
	});

	it('draws each point as a zero-length subpath rounded to 0.1', () => {
		expect(
			dotsPath([
				[1.234, 5.678],
				[10, 20]
			])
		).toBe('M1.2 5.7h0M10 20h0');
	});
});
