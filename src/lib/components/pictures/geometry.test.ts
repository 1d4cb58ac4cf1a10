import { describe, expect, it } from 'vitest';
import { sectionArea } from '$lib/calc';
import {
	blockageLevel,
	dotsPath,
	formatCompact,
	gridExtent,
	labelledLogTicks,
	logDomain,
	minSpacing,
	roundedBodyPath,
	sectionOutline,
	slottedWall,
	slottedWalls,
	splitBySection,
	type Point,
	type Segment
} from './geometry';

function expectPoints(actual: readonly Point[], expected: readonly Point[]) {
	expect(actual).toHaveLength(expected.length);
	actual.forEach(([x, y], i) => {
		expect(x).toBeCloseTo((expected[i] as Point)[0], 12);
		expect(y).toBeCloseTo((expected[i] as Point)[1], 12);
	});
}

const length = ([[x1, y1], [x2, y2]]: Segment) => Math.hypot(x2 - x1, y2 - y1);

// Shoelace formula for the area enclosed by a simple polygon.
function polygonArea(points: readonly Point[]): number {
	let twice = 0;
	points.forEach(([x1, y1], i) => {
		const [x2, y2] = points[(i + 1) % points.length] as Point;
		twice += x1 * y2 - x2 * y1;
	});
	return Math.abs(twice) / 2;
}

describe('section outline', () => {
	it('cuts a 45° fillet off each corner of a 2 × 1 m section', () => {
		expectPoints(sectionOutline(2, 1, 0.1), [
			[-0.9, 0],
			[0.9, 0],
			[1, 0.1],
			[1, 0.9],
			[0.9, 1],
			[-0.9, 1],
			[-1, 0.9],
			[-1, 0.1]
		]);
	});

	it('encloses the same area as the calc core gives the section', () => {
		const section = { kind: 'closed' as const, width_m: 2.4, height_m: 1.8, cornerFillet_m: 0.15 };
		expect(polygonArea(sectionOutline(2.4, 1.8, 0.15))).toBeCloseTo(sectionArea(section), 12);
	});

	it('is the four corners without fillets', () => {
		expectPoints(sectionOutline(1.6, 1.2), [
			[-0.8, 0],
			[0.8, 0],
			[0.8, 1.2],
			[-0.8, 1.2]
		]);
	});
});

describe('slotted walls', () => {
	it('leaves equal solid pieces between equal slots', () => {
		// 30 % open in two slots: gaps of 0.15, three solid pieces of 0.7 / 3.
		const pieces = slottedWall([0, 0], [1, 0], 2, 0.3);
		const solid = 0.7 / 3;
		expectPoints(pieces.flat(), [
			[0, 0],
			[solid, 0],
			[solid + 0.15, 0],
			[2 * solid + 0.15, 0],
			[2 * solid + 0.3, 0],
			[1, 0]
		]);
	});

	it('slots the side walls and ceiling but keeps the floor and fillets whole', () => {
		const segments = slottedWalls(2, 1, 0.1, 4, 0.2);
		// Floor 1 + fillets 4 + three walls of 5 solid pieces each.
		expect(segments).toHaveLength(20);
		expect(segments[0]).toEqual([
			[-0.9, 0],
			[0.9, 0]
		]);
		// Floor, then the lower right fillet, then the right wall.
		expect(length(segments[1] as Segment)).toBeCloseTo(0.1 * Math.SQRT2, 12);
		const rightWall = segments.slice(2, 7);
		const solid = rightWall.reduce((sum, s) => sum + length(s), 0);
		expect(solid).toBeCloseTo(0.8 * (1 - 0.2), 12);
	});

	it('slots the straight walls of an unfilleted section corner to corner', () => {
		const segments = slottedWalls(2, 1, 0, 3, 0.3);
		expect(segments).toHaveLength(1 + 3 * 4);
		expect(segments.at(-1)?.[1]).toEqual([-1, 0]);
	});
});

describe('model outline', () => {
	it('stands a rounded body on the floor with its exact width and height', () => {
		// Shoulders 0.3 and feet 0.08 of the smaller side (20): radii 6 and 1.6.
		expect(roundedBodyPath(10, 100, 50, 20)).toBe(
			'M11.6 100H58.4A1.6 1.6 0 0 0 60 98.4V86A6 6 0 0 0 54 80H16A6 6 0 0 0 10 86' +
				'V98.4A1.6 1.6 0 0 0 11.6 100Z'
		);
	});
});

describe('blockage level', () => {
	const limits = { caution: 0.05, limit: 0.075 };

	it('counts a ratio as over a level only when strictly above it', () => {
		expect(blockageLevel(0.041, limits)).toBe('good');
		expect(blockageLevel(0.05, limits)).toBe('good');
		expect(blockageLevel(0.0501, limits)).toBe('caution');
		expect(blockageLevel(0.075, limits)).toBe('caution');
		expect(blockageLevel(0.08, limits)).toBe('limit');
	});
});

describe('compact numbers', () => {
	it.each([
		[2.5e6, '2.5 M'],
		[30_000, '30 k'],
		[1.4e7, '14 M'],
		[385_000, '385 k'],
		[1_234_567, '1.23 M'],
		[999_950, '1 M'],
		[2.7e4, '27 k'],
		[3e9, '3 G'],
		[500, '500'],
		[0.5, '0.5'],
		[0, '0']
	])('writes %d as %s', (value, text) => {
		expect(formatCompact(value)).toBe(text);
	});
});

describe('log domain', () => {
	it('adds the margin as a fraction of the span in decades', () => {
		const [lo, hi] = logDomain([1e5, 3e6, 1e7], 0.08);
		expect(Math.log10(lo)).toBeCloseTo(4.84, 12);
		expect(Math.log10(hi)).toBeCloseTo(7.16, 12);
	});

	it('widens a narrow range to one decade about its middle before the margin', () => {
		const [lo, hi] = logDomain([2e4, 3e4], 0.08);
		expect(Math.log10(hi / lo)).toBeCloseTo(1.16, 12);
		expect(Math.sqrt(lo * hi)).toBeCloseTo(Math.sqrt(2e4 * 3e4), 6);
	});

	it('ignores missing and non-positive values', () => {
		const [lo, hi] = logDomain([NaN, 0, -5, 1e6], 0);
		expect(lo).toBeCloseTo(10 ** 5.5, 6);
		expect(hi).toBeCloseTo(10 ** 6.5, 6);
	});

	it('refuses a range with nothing to plot', () => {
		expect(() => logDomain([0, NaN])).toThrow(RangeError);
	});
});

describe('labelled log ticks', () => {
	it('labels the 1-2-5 series over two decades', () => {
		const ticks = [
			3e5, 4e5, 5e5, 6e5, 7e5, 8e5, 9e5, 1e6, 2e6, 3e6, 4e6, 5e6, 6e6, 7e6, 8e6, 9e6, 1e7, 2e7
		];
		expect(labelledLogTicks(ticks)).toEqual([5e5, 1e6, 2e6, 5e6, 1e7, 2e7]);
	});

	it('falls back to powers of ten over many decades', () => {
		const ticks = [4, 5, 6, 7, 8].flatMap((e) =>
			[1, 2, 3, 4, 5, 6, 7, 8, 9].map((m) => m * 10 ** e)
		);
		ticks.push(1e9);
		expect(labelledLogTicks(ticks)).toEqual([1e4, 1e5, 1e6, 1e7, 1e8, 1e9]);
	});

	it('labels every tick when there are few', () => {
		expect(labelledLogTicks([1e5, 1e6, 1e7])).toEqual([1e5, 1e6, 1e7]);
	});
});

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
