import { createTable, functionalUpdate, type Table, type TableState } from '@tanstack/table-core';
import {
	expandMatrix,
	isaAtmosphere,
	uniformGrid,
	type MatrixPlan,
	type MatrixRow
} from '$lib/calc';
import { matrixColumns, type MatrixColumn, type MatrixLabels } from './columns';
import { matrixTableOptions } from './model';

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

/**
 * The component's table-core pipeline without Svelte: state is a plain variable fed back through
 * `setOptions`, the way any table-core adapter does it.
 */
export function headlessMatrixTable(
	rows: MatrixRow[],
	labels: MatrixLabels = {}
): { table: Table<MatrixRow>; columns: MatrixColumn[] } {
	const columns = matrixColumns(() => labels);
	let state = {} as TableState;
	const table = createTable<MatrixRow>({
		...matrixTableOptions(columns),
		data: rows,
		state,
		onStateChange: (updater) => {
			state = functionalUpdate(updater, state);
			table.setOptions((previous) => ({ ...previous, state }));
		},
		renderFallbackValue: null
	});
	state = table.initialState;
	table.setOptions((previous) => ({ ...previous, state }));
	return { table, columns };
}
