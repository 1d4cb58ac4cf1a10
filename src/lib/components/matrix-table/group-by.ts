import type { GroupingState } from '@tanstack/table-core';
import type { MatrixColumnId } from './columns';

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
