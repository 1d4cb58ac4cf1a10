import {
	getCoreRowModel,
	getExpandedRowModel,
	getFilteredRowModel,
	getGroupedRowModel,
	getSortedRowModel,
	type ColumnDef,
	type FilterFn,
	type GroupingState,
	type SortingFn,
	type SortingState,
	type TableOptions
} from '@tanstack/table-core';
import type { MatrixRow } from '$lib/calc';
import { headerText, type MatrixColumn, type MatrixColumnId } from './columns';

export type GroupBy = 'none' | Extract<MatrixColumnId, 'configurationId' | 'planeId' | 'speed_mps'>;

export const GROUP_BY_CHOICES: { value: GroupBy; label: string }[] = [
	{ value: 'none', label: 'None' },
	{ value: 'configurationId', label: 'Configuration' },
	{ value: 'planeId', label: 'Plane' },
	{ value: 'speed_mps', label: 'Speed' }
];

export function groupingFor(groupBy: GroupBy): GroupingState {
	return groupBy === 'none' ? [] : [groupBy];
}

/** Reads a choice back from a select's value or the table's grouping; anything else is 'none'. */
export function toGroupBy(value: string | undefined): GroupBy {
	return GROUP_BY_CHOICES.find((choice) => choice.value === value)?.value ?? 'none';
}

export function groupByOf(grouping: GroupingState): GroupBy {
	return toGroupBy(grouping[0]);
}

const labelCollator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/**
 * Labels sort as read, so "Config 10" follows "Config 9". Most comparisons in a long sort are
 * between rows of the same configuration, hence the equality shortcut before the collator.
 */
function labelSorting(column: MatrixColumn): SortingFn<MatrixRow> {
	return (a, b, id) => {
		const left = a.getValue<string>(id);
		const right = b.getValue<string>(id);
		return left === right ? 0 : labelCollator.compare(column.format(left), column.format(right));
	};
}

/**
 * A search term matches a row when it appears in what one of its cells shows. Many rows share a
 * value (every point at one speed has the same q), so each number column keeps the text of the
 * values it has already formatted; with 50 000 rows a search formats only a few thousand. Label
 * text is not kept: a label is a cheap lookup and may be renamed while the table is open.
 */
function searchFilter(columns: MatrixColumn[]): FilterFn<MatrixRow> {
	const byId = new Map(columns.map((column) => [column.id, column]));
	const texts = new Map<MatrixColumnId, Map<MatrixRow[MatrixColumnId], string>>();
	const textOf = (column: MatrixColumn, value: MatrixRow[MatrixColumnId]): string => {
		if (column.kind === 'label') return column.format(value).toLowerCase();
		let seen = texts.get(column.id);
		if (!seen) {
			seen = new Map();
			texts.set(column.id, seen);
		}
		let text = seen.get(value);
		if (text === undefined) {
			text = column.format(value).toLowerCase();
			seen.set(value, text);
		}
		return text;
	};
	const match: FilterFn<MatrixRow> = (row, columnId, term: string) => {
		const column = byId.get(columnId as MatrixColumnId);
		// The original value, not row.getValue: that caches every cell on every row, and a search
		// visits all cells of every row that does not match.
		return column !== undefined && textOf(column, row.original[column.id]).includes(term);
	};
	match.resolveFilterValue = (value: unknown) => String(value).trim().toLowerCase();
	return match;
}

export function matrixColumnDefs(columns: MatrixColumn[]): ColumnDef<MatrixRow>[] {
	return columns.map((column) => ({
		id: column.id,
		accessorKey: column.id,
		header: headerText(column),
		enableHiding: column.hideable,
		sortingFn: column.kind === 'label' ? labelSorting(column) : 'basic',
		filterFn: 'equals',
		// A group row carries no aggregate, so sorting by another column than the grouped one
		// keeps the groups in run order and sorts the points inside each.
		aggregationFn: undefined
	}));
}

/**
 * Everything the matrix table needs from table-core except the rows, so the component and a
 * headless test build the same pipeline: filter, then group, then sort, then expand.
 */
export function matrixTableOptions(columns: MatrixColumn[]): Omit<TableOptions<MatrixRow>, 'data'> {
	return {
		columns: matrixColumnDefs(columns),
		getRowId: (row) => String(row.point),
		getCoreRowModel: getCoreRowModel(),
		getFilteredRowModel: getFilteredRowModel(),
		getGroupedRowModel: getGroupedRowModel(),
		getSortedRowModel: getSortedRowModel(),
		getExpandedRowModel: getExpandedRowModel(),
		globalFilterFn: searchFilter(columns),
		sortDescFirst: false,
		// Columns keep their places when grouped, so the eye finds speed where it always is.
		groupedColumnMode: false,
		// Groups stay open while the filter changes; the component collapses them when the grouping
		// itself changes.
		autoResetExpanded: false,
		autoResetPageIndex: false
	};
}

function sortWords(sorting: SortingState, columns: MatrixColumn[]): string {
	if (sorting.length === 0) return 'in run order';
	const parts = sorting.map((entry) => {
		const column = columns.find((c) => c.id === entry.id);
		const name = column ? headerText(column) : entry.id;
		return `${name} ${entry.desc ? 'descending' : 'ascending'}`;
	});
	return `sorted by ${parts.join(', then ')}`;
}

/** The order and grouping in words, for the footer line and for screen readers. */
export function describeView(
	sorting: SortingState,
	grouping: GroupingState,
	columns: MatrixColumn[]
): string {
	const groupBy = groupByOf(grouping);
	const grouped =
		groupBy === 'none'
			? 'not grouped'
			: `grouped by ${GROUP_BY_CHOICES.find((c) => c.value === groupBy)?.label.toLowerCase()}`;
	return `${sortWords(sorting, columns)}; ${grouped}`;
}
