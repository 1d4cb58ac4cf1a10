import type { SortingState } from '@tanstack/table-core';
import type { MatrixColumn } from './columns';
import type { ColumnarMatrix } from './columnar';

const labelCollator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });

/**
 * Numbers a point can be ordered by in one column: the values themselves, or for a label column
 * each label's rank in reading order, so "Config 10" follows "Config 9". A matrix has a handful of
 * labels, so ranking them costs nothing beside the sort.
 */
export function orderKeys(matrix: ColumnarMatrix, column: MatrixColumn): Float64Array {
	const values = matrix.values[column.id];
	const labels = matrix.labels[column.id];
	if (!labels) return values;
	const shown = labels.map((label) => column.format(label));
	const byReading = shown
		.map((_, code) => code)
		.sort((a, b) => labelCollator.compare(shown[a]!, shown[b]!));
	const rank = new Float64Array(labels.length);
	byReading.forEach((code, position) => {
		rank[code] = position;
	});
	// Labels that read the same share a rank, so run order decides between them.
	for (let i = 1; i < byReading.length; i++) {
		const code = byReading[i]!;
		const before = byReading[i - 1]!;
		if (labelCollator.compare(shown[code]!, shown[before]!) === 0) rank[code] = rank[before]!;
	}
	const keys = new Float64Array(matrix.length);
	for (let point = 0; point < matrix.length; point++) keys[point] = rank[values[point]!]!;
	return keys;
}

export type OrderKey = { keys: Float64Array; direction: 1 | -1 };

/** The sort entries as key arrays, skipping columns the table does not have. */
export function orderKeysFor(
	matrix: ColumnarMatrix,
	columns: readonly MatrixColumn[],
	sorting: SortingState
): OrderKey[] {
	const byId = new Map(columns.map((column) => [column.id as string, column]));
	return sorting.flatMap((entry) => {
		const column = byId.get(entry.id);
		return column ? [{ keys: orderKeys(matrix, column), direction: entry.desc ? -1 : 1 }] : [];
	});
}

/** Compares two points by each key in turn; equal points keep their run order. */
export function comparePoints(order: readonly OrderKey[]): (a: number, b: number) => number {
	if (order.length === 1) {
		const [{ keys, direction }] = order as [OrderKey];
		return (a, b) => {
			const left = keys[a]!;
			const right = keys[b]!;
			return left === right ? a - b : left < right ? -direction : direction;
		};
	}
	return (a, b) => {
		for (const { keys, direction } of order) {
			const left = keys[a]!;
			const right = keys[b]!;
			if (left !== right) return left < right ? -direction : direction;
		}
		return a - b;
	};
}

/** The points in the sort's order: a sorted copy of their indices, never of the points. */
export function sortPoints(
	matrix: ColumnarMatrix,
	points: Int32Array,
	columns: readonly MatrixColumn[],
	sorting: SortingState
): Int32Array {
	const order = orderKeysFor(matrix, columns, sorting);
	if (order.length === 0) return points;
	return points.slice().sort(comparePoints(order));
}
