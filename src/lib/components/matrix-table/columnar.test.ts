import { describe, expect, it } from 'vitest';
import { expandMatrix, isaAtmosphere, uniformGrid, type MatrixPlan } from '$lib/calc';
import { matrixColumns } from './columns';
import { planColumns, valueAt } from './columnar';
import { fixturePlan } from './matrix-fixture';
import { matrixFilterOptions } from './point-filter';

const columns = matrixColumns(() => ({}));

/** Two planes of different grids and two repeats, so runs differ in length and repeat. */
const unevenPlan: MatrixPlan = {
	...fixturePlan({ rows: 2, columns: 3 }),
	planes: [
		{
			id: 'near',
			downstream_m: 0.4,
			grid: uniformGrid({ rows: 3, columns: 2, rowSpacing_m: 0.05, columnSpacing_m: 0.1 })
		},
		{ id: 'far', downstream_m: 1.2, grid: { y_m: [0.02], z_m: [-0.1, 0, 0.1, 0.2] } }
	],
	repeats: 2,
	dynamicPressureFactor: 1.04,
	tunnelAir: isaAtmosphere(300)
};

describe('planColumns', () => {
	it.each([
		['the test campaign', fixturePlan({ rows: 2, columns: 2 })],
		['planes of unequal grids, repeated', unevenPlan]
	])('holds every value of every point the core expands, for %s', (_, plan) => {
		const rows = expandMatrix(plan);
		const matrix = planColumns(plan);
		expect(matrix.length).toBe(rows.length);
		const rebuilt = rows.map((_, point) =>
			Object.fromEntries(columns.map((c) => [c.id, valueAt(matrix, c.id, point)]))
		);
		expect(rebuilt).toEqual(rows);
	});

	it('stores each label once, in the order it is first run', () => {
		const matrix = planColumns(fixturePlan({ rows: 2, columns: 2 }));
		expect(matrix.labels.configurationId).toEqual(['baseline', 'spoiler']);
		expect(matrix.labels.planeId).toEqual(['wake-near', 'wake-far']);
		expect(matrix.labels.speed_mps).toBeUndefined();
	});
});

describe('matrixFilterOptions', () => {
	it('lists configurations and planes once each, in run order, with their labels', () => {
		const options = matrixFilterOptions(planColumns(fixturePlan({ rows: 2, columns: 2 })), {
			planes: { 'wake-far': 'Far wake, x = 1.5 m' }
		});
		expect(options.configurations).toEqual([
			{ value: 'baseline', label: 'baseline' },
			{ value: 'spoiler', label: 'spoiler' }
		]);
		expect(options.planes).toEqual([
			{ value: 'wake-near', label: 'wake-near' },
			{ value: 'wake-far', label: 'Far wake, x = 1.5 m' }
		]);
	});
});
