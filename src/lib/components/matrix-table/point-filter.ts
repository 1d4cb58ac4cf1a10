import type { ColumnFiltersState } from '@tanstack/table-core';
import { formatLabel, type MatrixColumn, type MatrixColumnId, type MatrixLabels } from './columns';
import type { ColumnarMatrix } from './columnar';

/**
 * The text a number column shows for each value it has formatted, kept across searches: many
 * points share a value (every point at one speed has the same q), so a search formats only the
 * distinct ones. Label text is not kept: a label is a cheap lookup and may be renamed while the
 * table is open.
 */
export type SearchTexts = Map<MatrixColumnId, Map<number, string>>;

function textOf(
	matrix: ColumnarMatrix,
	column: MatrixColumn,
	value: number,
	texts: SearchTexts
): string {
	const labels = matrix.labels[column.id];
	if (labels) return column.format(labels[value]!).toLowerCase();
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
}

/** Marks the points whose shown text in some column contains `term`. */
function markSearchHits(
	matrix: ColumnarMatrix,
	columns: readonly MatrixColumn[],
	term: string,
	texts: SearchTexts
): Uint8Array {
	const hit = new Uint8Array(matrix.length);
	for (const column of columns) {
		const values = matrix.values[column.id];
		const verdicts = new Map<number, boolean>();
		// Points in run order repeat a value over long stretches, so most need no lookup at all.
		let last = Number.NaN;
		let lastHit = false;
		for (let point = 0; point < matrix.length; point++) {
			if (hit[point]) continue;
			const value = values[point]!;
			if (value !== last) {
				last = value;
				let verdict = verdicts.get(value);
				if (verdict === undefined) {
					verdict = textOf(matrix, column, value, texts).includes(term);
					verdicts.set(value, verdict);
				}
				lastHit = verdict;
			}
			if (lastHit) hit[point] = 1;
		}
	}
	return hit;
}

/** The stored form of a filter's value in a column: a label's code, or the number itself. */
function codeOf(matrix: ColumnarMatrix, id: MatrixColumnId, value: unknown): number {
	const labels = matrix.labels[id];
	if (labels) return labels.indexOf(String(value));
	return typeof value === 'number' ? value : Number.NaN;
}

/**
 * The points the column filters (each an exact value) and the search over every column's shown
 * text leave, in run order.
 */
export function filterPoints(
	matrix: ColumnarMatrix,
	columns: readonly MatrixColumn[],
	filters: ColumnFiltersState,
	search: unknown,
	texts: SearchTexts
): Int32Array {
	const term = String(search ?? '')
		.trim()
		.toLowerCase();
	const hit = term ? markSearchHits(matrix, columns, term, texts) : null;
	const known = new Set<string>(columns.map((c) => c.id));
	const wanted = filters
		.filter((f) => known.has(f.id))
		.map((f) => ({
			values: matrix.values[f.id as MatrixColumnId],
			code: codeOf(matrix, f.id as MatrixColumnId, f.value)
		}));
	const kept = new Int32Array(matrix.length);
	let count = 0;
	next: for (let point = 0; point < matrix.length; point++) {
		if (hit && !hit[point]) continue;
		for (const { values, code } of wanted) if (values[point] !== code) continue next;
		kept[count++] = point;
	}
	return kept.subarray(0, count);
}

export type FilterOption = { value: string; label: string };

export type MatrixFilterOptions = {
	configurations: FilterOption[];
	planes: FilterOption[];
};

/** The configurations and planes present in the matrix, in the order they are first run. */
export function matrixFilterOptions(
	matrix: ColumnarMatrix,
	labels: MatrixLabels = {}
): MatrixFilterOptions {
	const options = (ids: string[] | undefined, names: Record<string, string> | undefined) =>
		(ids ?? []).map((value) => ({ value, label: formatLabel(value, names) }));
	return {
		configurations: options(matrix.labels.configurationId, labels.configurations),
		planes: options(matrix.labels.planeId, labels.planes)
	};
}
