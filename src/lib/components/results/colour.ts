import { scaleDiverging, scaleLinear } from 'd3-scale';

/**
 * Tunnelwright's diverging map colours: suction shades towards the accent, overpressure towards
 * the caution tone, zero is the panel itself. Mixing theme variables in the browser keeps the
 * maps right in light, dark and print without a second palette.
 */
const BELOW = 'var(--tnw-accent)';
const ABOVE = 'var(--tnw-caution)';
const MIDDLE = 'var(--tnw-panel)';

// About eight labelled steps across the bar; contour lines follow the same steps.
const STEP_COUNT = 8;

function shade(t: number): string {
	const side = t < 0.5 ? BELOW : ABOVE;
	const weight = Math.round(Math.min(1, Math.abs(t - 0.5) * 2) * 1000) / 10;
	return `color-mix(in oklab, ${side} ${weight}%, ${MIDDLE})`;
}

export type ColourScale = {
	fill: (value: number) => string;
	/** The scale runs from −limit through 0 to +limit. */
	limit: number;
	/** Labelled values on the legend and the contour levels. */
	steps: number[];
};

/**
 * A scale symmetric about zero, so that equal shades mean equal magnitudes on either side and
 * maps drawn with the same scale can be compared cell by cell.
 */
export function divergingScale(values: Iterable<number | null>): ColourScale {
	let largest = 0;
	for (const v of values)
		if (v !== null && Number.isFinite(v)) largest = Math.max(largest, Math.abs(v));
	const niced = scaleLinear()
		.domain([-(largest || 1), largest || 1])
		.nice(STEP_COUNT);
	const limit = niced.domain()[1] as number;
	const scale = scaleDiverging(shade).domain([-limit, 0, limit]).clamp(true);
	return { fill: (value) => scale(value), limit, steps: niced.ticks(STEP_COUNT) };
}

/** Categorical line colours from the theme, told apart by dash and marker as well. */
export const SERIES_COLOURS = [
	'var(--tnw-accent)',
	'var(--tnw-caution)',
	'var(--tnw-good)',
	'var(--tnw-ink-soft)',
	'var(--tnw-limit)'
] as const;

/** A shade from the accent towards the caution tone, for ordered series such as probe rows. */
export function graded(t: number): string {
	return `color-mix(in oklab, ${ABOVE} ${Math.round(Math.min(1, Math.max(0, t)) * 100)}%, ${BELOW})`;
}
