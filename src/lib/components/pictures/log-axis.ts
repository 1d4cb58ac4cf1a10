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
