/**
 * Geometry of a traverse plane's probe grid for the maps, in metres: z lateral from the
 * centreline, y up from the floor. Grids may be unevenly spaced, so nothing here assumes a step.
 */
import { contours } from 'd3-contour';
import type { Point } from '../pictures/section-shapes';

/**
 * The span each probe stands for along one axis: halfway to its neighbours, and as far beyond
 * the outermost probes as the nearest neighbour is inside, so uneven grids tile without gaps.
 * A lone position gets `lone_m`.
 */
export function cellSpans(positions: readonly number[], lone_m: number): [number, number][] {
	const sorted = [...new Set(positions)].sort((a, b) => a - b);
	return positions.map((p) => {
		const k = sorted.indexOf(p);
		const before = sorted[k - 1];
		const after = sorted[k + 1];
		if (before === undefined && after === undefined) return [p - lone_m / 2, p + lone_m / 2];
		const lo = before === undefined ? p - (after! - p) / 2 : (before + p) / 2;
		const hi = after === undefined ? p + (p - before!) / 2 : (p + after) / 2;
		return [lo, hi];
	});
}

/** Contours need an interior to interpolate over: four measured rows and four measured columns. */
const CONTOUR_MIN_SIDE = 4;

export function denseEnough(values: readonly (readonly (number | null)[])[]): boolean {
	const rows = values.filter((row) => row.some((v) => v !== null)).length;
	const columns = (values[0] ?? []).filter((_, j) => values.some((row) => row[j] !== null)).length;
	return rows >= CONTOUR_MIN_SIDE && columns >= CONTOUR_MIN_SIDE;
}

export type ContourLevel = { value: number; lines: Point[][] };

/** Position along an axis at a fractional probe index, linear between neighbouring probes. */
function along(positions: readonly number[], index: number): number {
	const k = Math.max(0, Math.min(Math.floor(index), positions.length - 2));
	const from = positions[k]!;
	const to = positions[k + 1] ?? from;
	return from + (index - k) * (to - from);
}

/**
 * Interpolated contour lines as (z, y) polylines in metres. Marching squares (d3-contour) runs
 * over the probe values with gaps filled only so that its rings close; every piece of line that
 * does not lie between four measured probes is then dropped, so no line is drawn beyond the
 * grid's edge or across a point without a reading.
 */
export function contourLines(
	values: readonly (readonly (number | null)[])[],
	y_m: readonly number[],
	z_m: readonly number[],
	levels: readonly number[]
): ContourLevel[] {
	const rows = values.length;
	const columns = values[0]?.length ?? 0;
	if (rows < 2 || columns < 2) return [];
	const measured = values.flat().filter((v): v is number => v !== null);
	const filler = measured.reduce((s, v) => s + v, 0) / Math.max(1, measured.length);
	const flat = values.flatMap((row) => row.map((v) => v ?? filler));
	const known = (i: number, j: number) => values[i]?.[j] !== null && values[i]?.[j] !== undefined;
	// d3-contour puts sample (i, j) at (j + 0.5, i + 0.5); square (i, j) has samples i…i+1, j…j+1.
	const inMeasuredSquare = (a: Point, b: Point) => {
		const j = Math.floor((a[0] + b[0]) / 2 - 0.5);
		const i = Math.floor((a[1] + b[1]) / 2 - 0.5);
		return (
			i >= 0 &&
			j >= 0 &&
			i < rows - 1 &&
			j < columns - 1 &&
			known(i, j) &&
			known(i + 1, j) &&
			known(i, j + 1) &&
			known(i + 1, j + 1)
		);
	};
	const toMetres = ([x, y]: Point): Point => [along(z_m, x - 0.5), along(y_m, y - 0.5)];

	return contours()
		.size([columns, rows])
		.thresholds([...levels])(flat)
		.map((geometry) => {
			const lines: Point[][] = [];
			for (const polygon of geometry.coordinates) {
				for (const ring of polygon) {
					let current: Point[] | null = null;
					for (let k = 0; k + 1 < ring.length; k++) {
						const a = ring[k] as unknown as Point;
						const b = ring[k + 1] as unknown as Point;
						if (!inMeasuredSquare(a, b)) {
							current = null;
							continue;
						}
						if (!current) {
							current = [toMetres(a)];
							lines.push(current);
						}
						current.push(toMetres(b));
					}
				}
			}
			return { value: geometry.value, lines };
		})
		.filter((level) => level.lines.length > 0);
}
