import { fixed } from '$lib/format';
import type { PlaneRunResult } from '$lib/results/types';
import { COVERAGE_NOTE, CP_DECIMALS, metres, plusMinus } from './figures';

/** One probe position as a map shows it: where it is, its value and what else to say on hover. */
export type MapCell = {
	row: number;
	column: number;
	y_m: number;
	z_m: number;
	value: number | null;
	/** Standard uncertainty of the value, when the reduction gives one per point. */
	u: number | null;
	more: string[];
};

export function cpCells(run: PlaneRunResult): MapCell[][] {
	return run.points.map((row) =>
		row.map((p) => ({
			row: p.row,
			column: p.column,
			y_m: p.y_m,
			z_m: p.z_m,
			value: p.cp,
			u: p.uCp,
			more: [
				p.cpCorrected === null ? null : `Cp corrected ${fixed(p.cpCorrected, CP_DECIMALS)}`,
				p.cp0 === null ? null : `Cp0 ${fixed(p.cp0, CP_DECIMALS)}`,
				`point ${p.point}`
			].filter((line) => line !== null)
		}))
	);
}

/** The variant − baseline map of a run compared with its baseline; null for the baseline itself. */
export function differenceCells(run: PlaneRunResult): MapCell[][] | null {
	const difference = run.difference;
	if (!difference) return null;
	return run.points.map((row, i) =>
		row.map((p, j) => ({
			row: p.row,
			column: p.column,
			y_m: p.y_m,
			z_m: p.z_m,
			value: difference.points[i]?.[j] ?? null,
			u: null,
			more: [`against run ${difference.baselineRun}`]
		}))
	);
}

/** The plane, row and column averages drawn beside a map, with their standard uncertainties. */
export type MapAverages = {
	plane: number | null;
	planeU: number | null;
	rows: (number | null)[];
	columns: (number | null)[];
	rowsU: (number | null)[];
	columnsU: (number | null)[];
};

export function cpAverages(run: PlaneRunResult): MapAverages {
	return {
		plane: run.averageCp,
		planeU: run.uncertainty.averageCp,
		rows: run.rowAverageCp,
		columns: run.columnAverageCp,
		rowsU: run.uncertainty.rowAverageCp,
		columnsU: run.uncertainty.columnAverageCp
	};
}

/** The averages of the variant − baseline map; null for the baseline itself. */
export function differenceAverages(run: PlaneRunResult): MapAverages | null {
	const d = run.difference;
	if (!d) return null;
	return {
		plane: d.average,
		planeU: d.uncertainty.average,
		rows: d.rowAverages,
		columns: d.columnAverages,
		rowsU: d.uncertainty.rowAverages,
		columnsU: d.uncertainty.columnAverages
	};
}

/** What a cell says to a screen reader and in its hover box: where it is and what was read. */
export function cellText(cell: MapCell, symbol: string): string {
	const where = `Row ${cell.row}, column ${cell.column}, y ${metres(cell.y_m)}, z ${metres(cell.z_m)}`;
	if (cell.value === null) return `${where}: no reading`;
	const uncertainty = cell.u === null ? '' : ` (${COVERAGE_NOTE})`;
	return `${where}: ${symbol} ${plusMinus(cell.value, cell.u)}${uncertainty}`;
}

/** Row indices top to bottom and column indices left to right, as the map draws them. */
export function drawnOrder(cells: MapCell[][]): { rows: number[]; columns: number[] } {
	const first = cells[0] ?? [];
	return {
		rows: cells.map((_, i) => i).sort((a, b) => cells[b]![0]!.y_m - cells[a]![0]!.y_m),
		columns: first.map((_, j) => j).sort((a, b) => first[a]!.z_m - first[b]!.z_m)
	};
}
