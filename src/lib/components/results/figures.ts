/**
 * How reduced figures are written on the results pages. The reduction carries standard
 * uncertainties (k = 1); every page shows expanded ones, U = k·u with k = 2 (JCGM 100:2008 §6),
 * and says so beside them.
 */
import type { PlaneRunResult } from '$lib/results/types';
import { fixed } from '$lib/format';

const COVERAGE_FACTOR = 2;
export const COVERAGE_NOTE = 'U, k = 2';
/** The same as a column heading or caption: "± U (k = 2)". */
export const EXPANDED_LABEL = 'U (k = 2)';

/** Pressure coefficients to a thousandth: finer than any tunnel's probe scatter. */
export const CP_DECIMALS = 3;

export const expanded = (standard: number) => COVERAGE_FACTOR * standard;

const MAX_DECIMALS = 6;

/** At least `decimals`, and enough that U = k·u keeps one significant figure rather than 0.000. */
export function decimalsFor(standard: number | null | undefined, decimals = CP_DECIMALS): number {
	if (standard === null || standard === undefined || !(standard > 0)) return decimals;
	const needed = Math.ceil(-Math.log10(expanded(standard)));
	return Math.max(decimals, Math.min(MAX_DECIMALS, needed));
}

/** A value and its U = k·u for two table cells, both to the decimals U needs; U "—" without one. */
export function valueAndExpanded(
	value: number,
	standard: number | null | undefined,
	decimals = CP_DECIMALS
): { value: string; expanded: string } {
	const d = decimalsFor(standard, decimals);
	return {
		value: fixed(value, d),
		expanded: standard === null || standard === undefined ? '—' : fixed(expanded(standard), d)
	};
}

/** "value ± U" with U = k·u; the value alone where there is no uncertainty to give. */
export function plusMinus(
	value: number,
	standard: number | null | undefined,
	decimals = CP_DECIMALS
): string {
	const shown = valueAndExpanded(value, standard, decimals);
	return standard === null || standard === undefined
		? shown.value
		: `${shown.value} ± ${shown.expanded}`;
}

const trimmedFormats = new Map<number, Intl.NumberFormat>();

/** Up to `decimals` decimals without trailing zeros, for settings such as 12 m/s or 7.5°. */
export function trimmed(value: number, decimals = 2): string {
	let format = trimmedFormats.get(decimals);
	if (!format) {
		format = new Intl.NumberFormat('en-GB', { maximumFractionDigits: decimals });
		trimmedFormats.set(decimals, format);
	}
	return format.format(value);
}

export const speedText = (speed_mps: number) => `${trimmed(speed_mps)} m/s`;
export const yawText = (yaw_deg: number) => `yaw ${trimmed(yaw_deg)}°`;

/** A run as people on the tunnel floor name it: configuration, speed, yaw and repeat. */
export function runTitle(run: PlaneRunResult): string {
	return `${run.configurationLabel} · ${speedText(run.speed_mps)} · ${yawText(run.yaw_deg)} · repeat ${run.repeat}`;
}

/** A metre figure to the millimetre, the finest a traverse is set to. */
export const metres = (value_m: number) => `${fixed(value_m, 3)} m`;
