import { CalcInputError, requireFinite } from './errors';

/** Readings over a traverse plane, [row][column]; null where the point has no reading. */
export type Grid = (number | null)[][];

export type GridAverages = {
	/** Mean of every reading in the plane (not the mean of the row means). */
	plane: number;
	/** Mean of each row's readings; null for a row without any. */
	rows: (number | null)[];
	/** Mean of each column's readings; null for a column without any. */
	columns: (number | null)[];
	/** Number of readings used. */
	count: number;
};

export type MatchedDifference = GridAverages & {
	/** variant − baseline where both have a reading, otherwise null. */
	points: (number | null)[][];
};

/** Refuses an empty or ragged grid and any reading that is neither a finite number nor null. */
export function requireGrid(parameter: string, values: Grid): { rows: number; columns: number } {
	if (!Array.isArray(values) || values.length === 0) {
		throw new CalcInputError(parameter, '[]', 'at least one row');
	}
	const columns = Array.isArray(values[0]) ? values[0].length : 0;
	if (columns === 0) throw new CalcInputError(`${parameter}[0]`, '[]', 'at least one column');
	for (let i = 0; i < values.length; i++) {
		const row = values[i];
		if (!Array.isArray(row) || row.length !== columns) {
			throw new CalcInputError(
				`${parameter}[${i}]`,
				`a row of ${Array.isArray(row) ? row.length : 0}`,
				`${columns} values, as many as the first row`
			);
		}
		for (let j = 0; j < columns; j++) {
			const v = row[j];
			if (v !== null && !Number.isFinite(v)) requireFinite(`${parameter}[${i}][${j}]`, v as number);
		}
	}
	return { rows: values.length, columns };
}

/**
 * One pass over the grid with running sums: a plane of a traverse survey is reduced thousands
 * of times per campaign, so no intermediate arrays.
 */
function averagesOf(parameter: string, values: Grid, columns: number): GridAverages {
	const rows = values.length;
	const rowSum = new Float64Array(rows);
	const rowCount = new Uint32Array(rows);
	const columnSum = new Float64Array(columns);
	const columnCount = new Uint32Array(columns);
	let sum = 0;
	let count = 0;
	for (let i = 0; i < rows; i++) {
		const row = values[i]!;
		for (let j = 0; j < columns; j++) {
			const v = row[j];
			if (v === null || v === undefined) continue;
			rowSum[i]! += v;
			rowCount[i]!++;
			columnSum[j]! += v;
			columnCount[j]!++;
			sum += v;
			count++;
		}
	}
	if (count === 0) throw new CalcInputError(parameter, 'no reading', 'at least one reading');
	const mean = (total: number, n: number) => {
		const m = total / n;
		if (!Number.isFinite(m))
			throw new CalcInputError(
				parameter,
				'values whose sum overflows',
				'values small enough to sum'
			);
		return m;
	};
	return {
		plane: mean(sum, count),
		rows: Array.from(rowSum, (total, i) => (rowCount[i] ? mean(total, rowCount[i]!) : null)),
		columns: Array.from(columnSum, (total, j) =>
			columnCount[j] ? mean(total, columnCount[j]!) : null
		),
		count
	};
}

/** Arithmetic means over a traverse plane, by row, by column and over the whole plane. */
export function gridAverages(values: Grid): GridAverages {
	const { columns } = requireGrid('values', values);
	return averagesOf('values', values, columns);
}

/**
 * Point-by-point difference of a variant from the baseline over the same grid, and its averages.
 * Only points read in both grids are compared, so a missing reading on either side is left out
 * rather than counted as a change.
 */
export function matchedDifference(variant: Grid, baseline: Grid): MatchedDifference {
	const shape = requireGrid('variant', variant);
	const baseShape = requireGrid('baseline', baseline);
	if (baseShape.rows !== shape.rows || baseShape.columns !== shape.columns) {
		throw new CalcInputError(
			'baseline',
			`a ${baseShape.rows}×${baseShape.columns} grid`,
			`the variant's shape, ${shape.rows}×${shape.columns}`
		);
	}
	const points = variant.map((row, i) =>
		row.map((v, j) => {
			const base = baseline[i]![j] ?? null;
			if (v === null || base === null) return null;
			const difference = v - base;
			if (!Number.isFinite(difference)) {
				throw new CalcInputError(
					`variant[${i}][${j}]`,
					v,
					'a reading whose difference from the baseline is finite'
				);
			}
			return difference;
		})
	);
	if (points.every((row) => row.every((d) => d === null))) {
		throw new CalcInputError(
			'baseline',
			'no point read in both grids',
			'at least one matched point'
		);
	}
	return { points, ...averagesOf('variant − baseline', points, shape.columns) };
}
