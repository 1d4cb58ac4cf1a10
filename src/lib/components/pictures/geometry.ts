/**
 * Geometry and number formatting behind the SVG pictures. Lengths are in metres in section
 * coordinates (z lateral from the centreline, positive to the right looking downstream; y up
 * from the floor) unless a function says it works in SVG user units.
 */
import type { BlockageLimits, ProbeGrid } from '$lib/calc';

export type Point = readonly [number, number];
export type Segment = readonly [Point, Point];

/**
 * The section's outline, counter-clockwise from the floor's left end. With fillets the eight
 * vertices alternate wall ends and fillet ends, so edges 0, 2, 4, 6 are the floor, right wall,
 * ceiling and left wall, and the odd edges are the 45° fillets; without, the four corners.
 */
export function sectionOutline(width_m: number, height_m: number, fillet_m = 0): Point[] {
	const r = width_m / 2;
	const l = -r;
	const h = height_m;
	if (fillet_m <= 0) {
		return [
			[l, 0],
			[r, 0],
			[r, h],
			[l, h]
		];
	}
	const f = fillet_m;
	return [
		[l + f, 0],
		[r - f, 0],
		[r, f],
		[r, h - f],
		[r - f, h],
		[l + f, h],
		[l, h - f],
		[l, f]
	];
}

/** The solid pieces of a wall from `from` to `to` with `slots` (one or more) evenly spaced gaps. */
export function slottedWall(from: Point, to: Point, slots: number, openRatio: number): Segment[] {
	const gap = openRatio / slots;
	const solid = (1 - openRatio) / (slots + 1);
	const at = (t: number): Point => [
		from[0] + (to[0] - from[0]) * t,
		from[1] + (to[1] - from[1]) * t
	];
	return Array.from({ length: slots + 1 }, (_, i) => {
		const start = i * (solid + gap);
		return [at(start), at(start + solid)];
	});
}

/**
 * The walls of a slotted section as solid segments. The floor stays whole because ground-based
 * models stand on it; the fillets stay whole because slots run along the flat walls.
 */
export function slottedWalls(
	width_m: number,
	height_m: number,
	fillet_m: number,
	slotsPerWall: number,
	openRatio: number
): Segment[] {
	const outline = sectionOutline(width_m, height_m, fillet_m);
	const step = outline.length === 8 ? 2 : 1;
	const segments: Segment[] = [];
	outline.forEach((from, i) => {
		const to = outline[(i + 1) % outline.length] as Point;
		const isWall = i % step === 0;
		const isFloor = i === 0;
		if (isWall && !isFloor) segments.push(...slottedWall(from, to, slotsPerWall, openRatio));
		else segments.push([from, to]);
	});
	return segments;
}

const round2 = (v: number) => Math.round(v * 100) / 100;

/**
 * A rounded body outline in SVG user units (y down) standing on `floor`: well-rounded shoulders,
 * nearly square feet. It stands for the model's frontal silhouette only; the blockage ratio comes
 * from the model's real frontal area, not from this shape.
 */
export function roundedBodyPath(
	left: number,
	floor: number,
	width: number,
	height: number
): string {
	const side = Math.min(width, height);
	const top = round2(side * 0.3);
	const foot = round2(side * 0.08);
	const l = round2(left);
	const r = round2(left + width);
	const b = round2(floor);
	const t = round2(floor - height);
	return [
		`M${round2(l + foot)} ${b}`,
		`H${round2(r - foot)}`,
		`A${foot} ${foot} 0 0 0 ${r} ${round2(b - foot)}`,
		`V${round2(t + top)}`,
		`A${top} ${top} 0 0 0 ${round2(r - top)} ${t}`,
		`H${round2(l + top)}`,
		`A${top} ${top} 0 0 0 ${l} ${round2(t + top)}`,
		`V${round2(b - foot)}`,
		`A${foot} ${foot} 0 0 0 ${round2(l + foot)} ${b}`,
		'Z'
	].join('');
}

export type BlockageLevel = 'good' | 'caution' | 'limit';

/** Strictly above a level counts as over it, as in the calc core's blockage findings. */
export function blockageLevel(ratio: number, limits: BlockageLimits): BlockageLevel {
	if (ratio > limits.limit) return 'limit';
	if (ratio > limits.caution) return 'caution';
	return 'good';
}

const PREFIXES: readonly (readonly [number, string])[] = [
	[1e9, ' G'],
	[1e6, ' M'],
	[1e3, ' k']
];

/** Three significant figures with an SI prefix: 2.5e6 → "2.5 M", 30000 → "30 k". */
export function formatCompact(value: number): string {
	// Round first so that 999 950 becomes "1 M", not "1000 k".
	const rounded = Number(value.toPrecision(3));
	const prefix = PREFIXES.find(([size]) => Math.abs(rounded) >= size);
	if (!prefix) return String(rounded);
	return `${Number((rounded / prefix[0]).toPrecision(3))}${prefix[1]}`;
}

/**
 * A log-axis domain holding every positive value, first widened about its middle to at least
 * `minDecades` so that the axis always shows a full decade of ticks, then by `marginFraction`
 * of its span at each end so that lines at the extremes keep room for their labels.
 */
export function logDomain(
	values: readonly number[],
	marginFraction = 0.08,
	minDecades = 1
): [number, number] {
	const logs = values.filter((v) => Number.isFinite(v) && v > 0).map(Math.log10);
	if (logs.length === 0) throw new RangeError('A log axis needs at least one positive value.');
	let lo = Math.min(...logs);
	let hi = Math.max(...logs);
	const shortBy = minDecades - (hi - lo);
	if (shortBy > 0) {
		lo -= shortBy / 2;
		hi += shortBy / 2;
	}
	const margin = marginFraction * (hi - lo);
	return [10 ** (lo - margin), 10 ** (hi + margin)];
}

function mantissa(value: number): number {
	const exponent = Math.floor(Math.round(Math.log10(value) * 1e9) / 1e9);
	return Math.round((value / 10 ** exponent) * 1e6) / 1e6;
}

const MANTISSA_SETS = [[1, 2, 5], [1, 3], [1]] as const;

/** Of a log axis's ticks, the ones to label: all if few, else the 1-2-5, 1-3 or 1 series. */
export function labelledLogTicks(ticks: readonly number[], maxLabels = 8): number[] {
	if (ticks.length <= maxLabels) return [...ticks];
	let chosen: number[] = [];
	for (const set of MANTISSA_SETS) {
		chosen = ticks.filter((t) => (set as readonly number[]).includes(mantissa(t)));
		if (chosen.length <= maxLabels) break;
	}
	return chosen;
}

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
