import { describe, expect, it } from 'vitest';
import { sectionArea } from '$lib/calc';
import {
	roundedBodyPath,
	sectionOutline,
	slottedWall,
	slottedWalls,
	type Point,
	type Segment
} from './section-shapes';

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
