import { READING_COLUMNS, REQUIRED_READING_COLUMNS } from '../../schemas/readings';
import type { ReadingsTable } from './file';
import type { ProblemList } from './problems';

/**
 * Problems with a file's header: unknown or repeated columns, required ones missing, and no way
 * to name a point (a `point` column, or `run`, `row` and `column` together).
 */
export function checkColumns(table: ReadingsTable, problems: ProblemList) {
	const row = table.format === 'csv' ? 1 : null;
	const known = new Set<string>(READING_COLUMNS);
	const seen = new Set<string>();
	for (const h of table.headers) {
		if (!known.has(h))
			problems.add(row, h, `is not a known column; the columns are ${READING_COLUMNS.join(', ')}`);
		else if (seen.has(h)) problems.add(row, h, 'appears twice in the header');
		seen.add(h);
	}
	for (const c of REQUIRED_READING_COLUMNS) if (!seen.has(c)) problems.add(row, c, 'is missing');
	if (!seen.has('point') && !['run', 'row', 'column'].every((c) => seen.has(c)))
		problems.add(row, 'point', 'is missing (or give run, row and column together)');
}

/** A record's cells by column name, as the row schema reads them. */
export function cellsByColumn(headers: readonly string[], cells: readonly unknown[]) {
	const named: Record<string, unknown> = {};
	for (let k = 0; k < headers.length; k++) named[headers[k]!] = cells[k];
	return named;
}
