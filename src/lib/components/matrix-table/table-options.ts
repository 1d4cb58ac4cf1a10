import { getCoreRowModel, type ColumnDef, type TableOptions } from '@tanstack/table-core';
import type { MatrixRow } from '$lib/calc';
import { headerText, type MatrixColumn } from './columns';

export function matrixColumnDefs(columns: MatrixColumn[]): ColumnDef<MatrixRow>[] {
	return columns.map((column) => ({
		id: column.id,
		accessorKey: column.id,
		header: headerText(column),
		enableHiding: column.hideable,
		filterFn: 'equals'
	}));
}

const NO_ROWS: MatrixRow[] = [];

/**
 * The matrix table's options for table-core, which keeps the view's state (sorting, filters,
 * search, grouping, open groups, shown columns) and answers the header controls. It is given no
 * rows: building a row object for each of 50 000 points is what made the table slow, so the points
 * stay typed arrays and are filtered, sorted and grouped as such (point-filter, point-order,
 * point-groups).
 */
export function matrixTableOptions(columns: MatrixColumn[]): TableOptions<MatrixRow> {
	return {
		data: NO_ROWS,
		columns: matrixColumnDefs(columns),
		getCoreRowModel: getCoreRowModel(),
		manualFiltering: true,
		manualSorting: true,
		manualGrouping: true,
		manualExpanding: true,
		sortDescFirst: false,
		// Columns keep their places when grouped, so the eye finds speed where it always is.
		groupedColumnMode: false,
		// Groups stay open while the filter changes; the controls collapse them when the grouping
		// itself changes.
		autoResetExpanded: false,
		autoResetPageIndex: false
	};
}
