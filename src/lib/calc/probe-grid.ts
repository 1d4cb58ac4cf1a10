import { CalcInputError, requireFinite, requirePositive, requireWholeNumber } from './errors';
import { MAX_POINTS_PER_PLANE } from './matrix';

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
	// Before the arrays exist: a count from a request must not size an allocation unchecked.
	if (spec.rows * spec.columns > MAX_POINTS_PER_PLANE)
		throw new CalcInputError(
			'grid',
			`${spec.rows} × ${spec.columns} points`,
			`at most ${MAX_POINTS_PER_PLANE} points in one plane`
		);
	requirePositive('rowSpacing_m', spec.rowSpacing_m);
	requirePositive('columnSpacing_m', spec.columnSpacing_m);
	const y0 = requireFinite('firstRow_m', spec.firstRow_m ?? 0);
	const z0 = requireFinite('firstColumn_m', spec.firstColumn_m ?? 0);
	return {
		y_m: Array.from({ length: spec.rows }, (_, i) => y0 + i * spec.rowSpacing_m),
		z_m: Array.from({ length: spec.columns }, (_, j) => z0 + j * spec.columnSpacing_m)
	};
}
