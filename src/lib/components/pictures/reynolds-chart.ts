import { fixed } from '$lib/format';
import { formatCompact } from './number-format';

/** A campaign speed on the chart, with the figures' own Re and envelope verdict. */
export type ChartPoint = { speed_mps: number; modelRe: number; outsideEnvelope: boolean };

export type ReferenceLine = { value: number; name: string; colour: string; dash?: string };

/**
 * The lowest speed in [from, to] at which the model's Re reaches `floorRe`, found by bisection on
 * the rising Re line so that the drawn line starts exactly at the bottom of the axis.
 */
export function speedReaching(
	modelReAt: (speed_mps: number) => number,
	floorRe: number,
	from_mps: number,
	to_mps: number
): number {
	if (modelReAt(from_mps) >= floorRe) return from_mps;
	if (modelReAt(to_mps) < floorRe) return to_mps;
	let low = from_mps;
	let high = to_mps;
	// Fifty halvings take any tunnel's speed range below a picometre per second.
	for (let i = 0; i < 50; i++) {
		const mid = (low + high) / 2;
		if (modelReAt(mid) >= floorRe) high = mid;
		else low = mid;
	}
	return high;
}

/** `count + 1` evenly spaced speeds from `from` to `to`, none if the span is empty. */
export function sampleSpeeds(from_mps: number, to_mps: number, count: number): number[] {
	if (!(to_mps > from_mps)) return [];
	return Array.from({ length: count + 1 }, (_, i) => from_mps + ((to_mps - from_mps) * i) / count);
}

/**
 * The reference lines in descending order, the higher labelled above itself and the lower below,
 * so that the two labels never sit on top of each other; a label that would leave the plot
 * turns over.
 */
export function placeReferences(
	lines: ReferenceLine[],
	yOf: (value: number) => number,
	plot: { top: number; bottom: number },
	clearance: number
): (ReferenceLine & { y: number; labelAbove: boolean })[] {
	return [...lines]
		.sort((a, b) => b.value - a.value)
		.map((r, i) => {
			const y = yOf(r.value);
			const labelAbove = i === 0 ? y - clearance >= plot.top : y + clearance > plot.bottom;
			return { ...r, y, labelAbove };
		});
}

/** The chart in words, for its accessible name. */
export function reynoldsSummary(x: {
	speedRange_mps: [number, number];
	modelReferenceLength_m: number;
	modelReAt: (speed_mps: number) => number;
	fullScaleRe: number | null;
	threshold: number | null;
	points: ChartPoint[];
}): string {
	const [min, max] = x.speedRange_mps;
	const parts = [
		`Model Reynolds number ${formatCompact(x.modelReAt(min))} to ` +
			`${formatCompact(x.modelReAt(max))} over the facility's ` +
			`${formatCompact(min)}–${formatCompact(max)} m/s ` +
			`(reference length ${fixed(x.modelReferenceLength_m, 3)} m)`
	];
	if (x.fullScaleRe !== null) parts.push(`full scale ${formatCompact(x.fullScaleRe)}`);
	if (x.threshold !== null) {
		const threshold = x.threshold;
		const reaching = x.points.filter((p) => p.modelRe >= threshold).length;
		parts.push(
			`Re-independence threshold ${formatCompact(threshold)}, ` +
				`reached at ${reaching} of ${x.points.length} campaign speeds`
		);
	}
	if (x.points.length > 0)
		parts.push(`campaign speeds ${x.points.map((p) => formatCompact(p.speed_mps)).join(', ')} m/s`);
	const outside = x.points.filter((p) => p.outsideEnvelope).length;
	if (outside > 0) parts.push(`${outside} outside the facility's envelope`);
	return parts.join('; ');
}
