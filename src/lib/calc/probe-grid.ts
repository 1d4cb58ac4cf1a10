import { requireFinite, requirePositive, requireWholeNumber } from './errors';

/** Probe positions in a traverse plane: rows at heights y, columns at lateral positions z. */
export type ProbeGrid = { y_m: number[]; z_m: number[] };

export type UniformGridSpec = {
	rows: number;
	columns: number;
	rowSpacing_m: number;
	columnSpacing_m: number;
	firstRow_m?: number;
	firstColumn_m?: number;
};

/** A rectangular probe grid of evenly spaced rows and columns. */
export function uniformGrid(spec: UniformGridSpec): ProbeGrid {
	requireWholeNumber('rows', spec.rows, 1);
	requireWholeNumber('columns', spec.columns, 1);
	requirePositive('rowSpacing_m', spec.rowSpacing_m);
	requirePositive('columnSpacing_m', spec.columnSpacing_m);
	const y0 = requireFinite('firstRow_m', spec.firstRow_m ?? 0);
	const z0 = requireFinite('firstColumn_m', spec.firstColumn_m ?? 0);
	return {
		y_m: Array.from({ length: spec.rows }, (_, i) => y0 + i * spec.rowSpacing_m),
		z_m: Array.from({ length: spec.columns }, (_, j) => z0 + j * spec.columnSpacing_m)
	};
}
