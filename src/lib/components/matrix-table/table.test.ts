import { describe, expect, it } from 'vitest';
import {
	getFilteredRowModel,
	getGroupedRowModel,
	getSortedRowModel,
	type TableState,
	type Updater
} from '@tanstack/table-core';
import type { MatrixRow } from '$lib/calc';
import { matrixColumns } from './columns';
import { fixtureRows } from './matrix-fixture';
import { matrixTableOptions } from './table-options';
import { createSvelteTable } from './table.svelte';

const rows = fixtureRows({ rows: 2, columns: 3 });
// The matrix table keeps only state in table-core; these checks of the adapter let table-core
// compute rows too, so they show the rows follow the state kept in Svelte.
const options = () => ({
	...matrixTableOptions(matrixColumns(() => ({}))),
	manualFiltering: false,
	manualSorting: false,
	manualGrouping: false,
	getFilteredRowModel: getFilteredRowModel<MatrixRow>(),
	getGroupedRowModel: getGroupedRowModel<MatrixRow>(),
	getSortedRowModel: getSortedRowModel<MatrixRow>()
});

describe('createSvelteTable', () => {
	it('keeps the state the table changes and computes rows from it', () => {
		const table = createSvelteTable<MatrixRow>({ ...options(), data: rows });
		expect(table.getState().sorting).toEqual([]);
		table.setSorting([{ id: 'point', desc: true }]);
		expect(table.getState().sorting).toEqual([{ id: 'point', desc: true }]);
		expect(table.getRowModel().rows[0]!.original.point).toBe(rows.length);
		table.getColumn('planeId')!.setFilterValue('wake-far');
		expect(table.getState().sorting).toEqual([{ id: 'point', desc: true }]);
		expect(table.getRowModel().rows).toHaveLength(rows.length / 2);
	});

	it('reads options given as getters afresh, so new rows reach the table', () => {
		let data = rows;
		const table = createSvelteTable<MatrixRow>({
			...options(),
			get data() {
				return data;
			}
		});
		expect(table.getRowModel().rows).toHaveLength(rows.length);
		data = rows.slice(0, 7);
		expect(table.getRowModel().rows.map((r) => r.original.point)).toEqual([1, 2, 3, 4, 5, 6, 7]);
	});

	it('starts from the initial state and tells a listener of each change', () => {
		const seen: Updater<TableState>[] = [];
		const table = createSvelteTable<MatrixRow>({
			...options(),
			data: rows,
			initialState: { grouping: ['planeId'] },
			onStateChange: (updater) => seen.push(updater)
		});
		expect(table.getRowModel().rows).toHaveLength(2);
		table.setGrouping([]);
		expect(seen).toHaveLength(1);
		expect(table.getRowModel().rows).toHaveLength(rows.length);
	});
});
