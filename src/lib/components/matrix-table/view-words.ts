import type { GroupingState, SortingState } from '@tanstack/table-core';
import { headerText, type MatrixColumn } from './columns';
import { GROUP_BY_CHOICES, groupByOf } from './group-by';

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
