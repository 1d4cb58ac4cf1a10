import type { Table } from '@tanstack/table-core';
import type { MatrixRow } from '$lib/calc';
import type { MatrixColumn } from './columns';
import type { ColumnarMatrix } from './columnar';
import { groupByOf } from './group-by';
import { filterPoints, type SearchTexts } from './point-filter';
import { groupPoints, matrixLines, type MatrixLines, type PointGroup } from './point-groups';
import { sortPoints } from './point-order';

export type MatrixView = {
	/** The points the filters and search leave, in run order. */
	readonly shown: Int32Array;
	/** A point's index, or `-1 - g` for the heading of `groups[g]`. */
	readonly lines: Int32Array;
	readonly groups: PointGroup[];
};

/**
 * The lines the matrix table shows, from its points and table-core's state. Each stage is its own
 * `$derived` reading only its slice of the state, so opening a group does not sort again and a
 * sort does not filter again. Call during component initialisation.
 */
export function createMatrixView(
	matrix: () => ColumnarMatrix,
	table: Table<MatrixRow>,
	columns: MatrixColumn[]
): MatrixView {
	// A cache of formatted text that nothing reads reactively.
	// eslint-disable-next-line svelte/prefer-svelte-reactivity
	const texts: SearchTexts = new Map();
	const filters = $derived(table.getState().columnFilters);
	const search = $derived(table.getState().globalFilter);
	const sorting = $derived(table.getState().sorting);
	const groupBy = $derived(groupByOf(table.getState().grouping));
	const expanded = $derived(table.getState().expanded);

	const shown = $derived(filterPoints(matrix(), columns, filters, search, texts));
	const sorted = $derived(sortPoints(matrix(), shown, columns, sorting));
	const groups = $derived.by(() => {
		const column = columns.find((c) => c.id === groupBy);
		return column ? groupPoints(matrix(), shown, sorted, column, sorting) : null;
	});
	const arranged: MatrixLines = $derived(matrixLines(sorted, groups, expanded));

	return {
		get shown() {
			return shown;
		},
		get lines() {
			return arranged.lines;
		},
		get groups() {
			return arranged.groups;
		}
	};
}
