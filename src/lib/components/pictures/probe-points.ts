import type { ProbeGrid } from '$lib/calc';
import type { Point } from './section-shapes';

export type GridExtent = {
	rows: number;
	columns: number;
	points: number;
	y_m: [number, number] | null;
	z_m: [number, number] | null;
};

const span = (values: readonly number[]): [number, number] | null =>
	values.length === 0 ? null : [Math.min(...values), Math.max(...values)];

export function gridExtent(grid: ProbeGrid): GridExtent {
	return {
		rows: grid.y_m.length,
		columns: grid.z_m.length,
		points: grid.y_m.length * grid.z_m.length,
		y_m: span(grid.y_m),
		z_m: span(grid.z_m)
	};
}

// A probe set exactly on a wall, up to round-off, is counted as inside.
const WALL_TOLERANCE_M = 1e-9;

/** The grid's points as (z, y), split by whether they lie within the section's walls. */
export function splitBySection(
	grid: ProbeGrid,
	section: { width_m: number; height_m: number }
): { inside: Point[]; outside: Point[] } {
	const halfWidth = section.width_m / 2 + WALL_TOLERANCE_M;
	const inside: Point[] = [];
	const outside: Point[] = [];
	for (const y of grid.y_m) {
		const rowInside = y >= -WALL_TOLERANCE_M && y <= section.height_m + WALL_TOLERANCE_M;
		for (const z of grid.z_m) {
			(rowInside && Math.abs(z) <= halfWidth ? inside : outside).push([z, y]);
		}
	}
	return { inside, outside };
}

/** The smallest gap between distinct values, or null with fewer than two distinct values. */
export function minSpacing(values: readonly number[]): number | null {
	const sorted = [...new Set(values)].sort((a, b) => a - b);
	let smallest: number | null = null;
	for (let i = 1; i < sorted.length; i++) {
		const gap = (sorted[i] as number) - (sorted[i - 1] as number);
		if (smallest === null || gap < smallest) smallest = gap;
	}
	return smallest;
}

const round1 = (v: number) => Math.round(v * 10) / 10;

/**
 * Many dots as one path of zero-length subpaths, in SVG user units. Stroked with round caps,
 * each subpath paints a circle of the stroke's width, so ten thousand probe points cost one
 * element and about a dozen characters each.
 */
export function dotsPath(points: readonly Point[]): string {
	return points.map(([x, y]) => `M${round1(x)} ${round1(y)}h0`).join('');
}
