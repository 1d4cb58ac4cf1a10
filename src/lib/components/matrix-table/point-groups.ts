import type { ExpandedState, SortingState } from '@tanstack/table-core';
import type { MatrixColumn, MatrixColumnId } from './columns';
import { valueAt, type ColumnarMatrix } from './columnar';
import { comparePoints, orderKeysFor } from './point-order';

export type PointGroup = {
	/** `column:value`, the key of the group in the expanded state. */
	id: string;
	columnId: MatrixColumnId;
	/** The first of its points in run order, whose value the heading shows. */
	first: number;
	/** Its points in the sort's order. */
	points: number[];
};

/**
 * What the table lists, top to bottom: a point's index, or `-1 - g` for the heading of group g.
 * Only the lines on screen are ever turned into rows.
 */
export type MatrixLines = { lines: Int32Array; groups: PointGroup[] };

/**
 * Groups the points by one column. Groups come in the order they are first run, and in that
 * column's order when it is also a sort key; a group row carries no total, so sorting by another
 * column orders the points inside each group only.
 */
export function groupPoints(
	matrix: ColumnarMatrix,
	runOrder: Int32Array,
	sorted: Int32Array,
	column: MatrixColumn,
	sorting: SortingState
): PointGroup[] {
	const values = matrix.values[column.id];
	const groupOf = new Map<number, number>();
	const groups: PointGroup[] = [];
	for (const point of runOrder) {
		const value = values[point]!;
		if (groupOf.has(value)) continue;
		groupOf.set(value, groups.length);
		const id = `${column.id}:${valueAt(matrix, column.id, point)}`;
		groups.push({ id, columnId: column.id, first: point, points: [] });
	}
	for (const point of sorted) groups[groupOf.get(values[point]!)!]!.points.push(point);
	const ownSort = sorting.filter((entry) => entry.id === column.id);
	if (ownSort.length === 0) return groups;
	const compare = comparePoints(orderKeysFor(matrix, [column], ownSort));
	return groups.sort((a, b) => compare(a.first, b.first));
}

export function isExpanded(expanded: ExpandedState, id: string): boolean {
	return expanded === true || expanded[id] === true;
}

/** The lines for the points as sorted, each group heading followed by its points when open. */
export function matrixLines(
	sorted: Int32Array,
	groups: PointGroup[] | null,
	expanded: ExpandedState
): MatrixLines {
	if (!groups) return { lines: sorted, groups: [] };
	let count = groups.length;
	for (const group of groups) if (isExpanded(expanded, group.id)) count += group.points.length;
	const lines = new Int32Array(count);
	let at = 0;
	groups.forEach((group, g) => {
		lines[at++] = -1 - g;
		if (isExpanded(expanded, group.id)) for (const point of group.points) lines[at++] = point;
	});
	return { lines, groups };
}

/** Opens or closes one group; from "all open" that means every other group stays open. */
export function toggleGroup(
	expanded: ExpandedState,
	id: string,
	groups: readonly PointGroup[]
): ExpandedState {
	const open: Record<string, boolean> =
		expanded === true ? Object.fromEntries(groups.map((g) => [g.id, true])) : { ...expanded };
	open[id] = !open[id];
	return open;
}
