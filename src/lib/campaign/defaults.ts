import type { ProbeGridSpec } from '../schemas/campaign';

/** A new plane's starting grid: 5 × 5 points at 20 mm, centred, the lowest row 10 mm up. */
export function startingGrid(mode: 'uniform' | 'explicit' = 'uniform'): ProbeGridSpec {
	return mode === 'uniform'
		? {
				mode,
				rows: 5,
				columns: 5,
				rowSpacing_m: 0.02,
				columnSpacing_m: 0.02,
				firstRow_m: 0.01,
				firstColumn_m: -0.04
			}
		: { mode, y_m: [0.01, 0.03, 0.05], z_m: [-0.02, 0, 0.02] };
}
