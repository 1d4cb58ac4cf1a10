import type { Table } from '@tanstack/table-core';
import {
	expandMatrix,
	isaAtmosphere,
	uniformGrid,
	type MatrixPlan,
	type MatrixRow
} from '$lib/calc';
import { matrixColumns, type MatrixColumn, type MatrixLabels } from './columns';
import { planColumns, type ColumnarMatrix } from './columnar';
import { createMatrixView, type MatrixView } from './matrix-view.svelte';
import { createSvelteTable } from './table.svelte';
import { matrixTableOptions } from './table-options';

export const FIXTURE_SPEEDS_MPS = [20, 25, 30, 35, 40];

export type FixtureGrid = { rows: number; columns: number };

/** Probe rows × columns in each plane of the full-size campaign: 50 000 points in all. */
export const FULL_GRID: FixtureGrid = { rows: 25, columns: 20 };

/**
 * The test campaign: 2 configurations × 5 speeds × 5 yaw angles × 2 planes of `grid` points, at
 * sea-level ISA air; 100 points per probe point of a plane.
 */
export function fixturePlan(grid: FixtureGrid = FULL_GRID): MatrixPlan {
	const probes = uniformGrid({
		rows: grid.rows,
		columns: grid.columns,
		rowSpacing_m: 0.02,
		columnSpacing_m: 0.025,
		firstRow_m: 0.01,
		firstColumn_m: -0.2375
	});
	return {
		configurations: [{ id: 'baseline', baseline: true }, { id: 'spoiler' }],
		speeds_mps: FIXTURE_SPEEDS_MPS,
		yawAngles_deg: [-10, -5, 0, 5, 10],
		planes: [
			{ id: 'wake-near', downstream_m: 0.5, grid: probes },
			{ id: 'wake-far', downstream_m: 1.5, grid: probes }
		],
		dwellPerPoint_s: 10,
		repeats: 1,
		modelReferenceLength_m: 1.15,
		tunnelAir: isaAtmosphere(0)
	};
}

export function fixtureRows(grid: FixtureGrid = FULL_GRID): MatrixRow[] {
	return expandMatrix(fixturePlan(grid));
}

export type HeadlessMatrixTable = {
	table: Table<MatrixRow>;
	columns: MatrixColumn[];
	matrix: ColumnarMatrix;
	view: MatrixView;
	/** The points listed now, as the rows they were made from; group headings left out. */
	listedPoints: () => MatrixRow[];
};

/** The component's table and view without the component: the same state, stages and options. */
export function headlessMatrixTable(
	plan: MatrixPlan,
	labels: MatrixLabels = {}
): HeadlessMatrixTable {
	const columns = matrixColumns(() => labels);
	const table = createSvelteTable(matrixTableOptions(columns));
	const matrix = planColumns(plan);
	// The rows the same core expands, to check the points listed against.
	const rows = expandMatrix(plan);
	const view = createMatrixView(() => matrix, table, columns);
	const listedPoints = () =>
		Array.from(
			view.lines.filter((line) => line >= 0),
			(p) => rows[p]!
		);
	return { table, columns, matrix, view, listedPoints };
}
