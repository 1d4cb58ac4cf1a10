import { stringify } from 'csv-stringify/sync';
import { READING_COLUMNS, type ReadingColumn } from '../../schemas/readings';
import type { ApprovedLayout } from './layout';

/** The template leaves out the manometer columns; a file may add them where a column was read. */
const TEMPLATE_COLUMNS = READING_COLUMNS.filter(
	(c) => c !== 'manometer_inclination_deg' && c !== 'manometer_fluid_density'
);

/**
 * A readings file to fill in: one row per planned point of the approved revision, identified
 * by point, run, row and column and described by configuration, yaw, speed, plane and probe
 * position, with the reading and reference columns empty.
 */
export function readingsTemplateCsv(approved: ApprovedLayout): string {
	const planes = new Map(approved.plan.planes.map((p) => [p.id, p]));
	const records: unknown[][] = [];
	for (const r of approved.layout.runs) {
		const grid = planes.get(r.planeId)!.grid;
		for (let i = 0; i < r.rows; i++) {
			for (let j = 0; j < r.columns; j++) {
				const cells: Partial<Record<ReadingColumn, unknown>> = {
					point: r.firstPoint + i * r.columns + j,
					run: r.run,
					configuration: r.configurationId,
					yaw_deg: r.yaw_deg,
					speed_mps: r.speed_mps,
					plane: r.planeId,
					repeat: r.repeat,
					row: i + 1,
					column: j + 1,
					y_m: grid.y_m[i],
					z_m: grid.z_m[j],
					kind: 'static',
					unit: 'Pa',
					reference_unit: 'Pa',
					barometric_unit: 'hPa'
				};
				records.push(TEMPLATE_COLUMNS.map((c) => cells[c] ?? ''));
			}
		}
	}
	return stringify(records, { header: true, columns: [...TEMPLATE_COLUMNS] });
}
