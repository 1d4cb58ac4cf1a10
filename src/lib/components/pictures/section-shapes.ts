/**
 * Outlines behind the SVG pictures. Lengths are in metres in section coordinates (z lateral from
 * the centreline, positive to the right looking downstream; y up from the floor) unless a
 * function says it works in SVG user units.
 */
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
