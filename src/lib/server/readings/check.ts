import { setImmediate as nextTurn } from 'node:timers/promises';
import type { MatrixPlan, RunLayout } from '../../calc';
import type { MeasuredConditions, ReadingProblem } from '../../readings/types';
import { READING_KINDS, readingRowSchema, type ReadingKind } from '../../schemas/readings';
import { cellsByColumn, checkColumns } from './columns';
import type { ReadingsTable } from './file';
import { checkIdentity, locateRow } from './point-location';
import { ProblemList } from './problems';
import { rowPressure_Pa } from './row-units';
import { RunConditionsGathering } from './run-conditions';

export type CheckedReading = {
	point: number;
	run: number;
	kind: ReadingKind;
	pressure_Pa: number;
	value: number;
	unit: string;
	inclination_deg: number | null;
	fluidDensity_kgm3: number | null;
	measuredAt: Date | null;
	note: string | null;
};

export type RunConditions = MeasuredConditions & { run: number };

export type CheckOutcome =
	| { ok: true; readings: CheckedReading[]; conditions: RunConditions[] }
	| { ok: false; problems: ReadingProblem[]; problemCount: number };

export type Progress = (done: number, total: number) => void;

const YIELD_EVERY = 5000;

/**
 * Checks every row of a readings table against the approved matrix: identity, units, physical
 * ranges, duplicates and each run's reference conditions. All or nothing: any problem refuses
 * the whole file, with the first problems and their count.
 */
export async function checkReadings(
	table: ReadingsTable,
	plan: MatrixPlan,
	layout: RunLayout,
	progress: Progress = () => {}
): Promise<CheckOutcome> {
	const problems = new ProblemList();
	checkColumns(table, problems);
	if (problems.count) return problems.refusal();

	const planes = new Map(plan.planes.map((p) => [p.id, p]));
	const kindIndex = new Map(READING_KINDS.map((k, i) => [k, i]));
	const firstRowOf = new Map<number, number>();
	const runs = new Map<number, RunConditionsGathering>();
	const readings: CheckedReading[] = [];
	const total = table.records.length;
	const readingColumn = table.headers.indexOf('reading');

	for (let i = 0; i < total; i++) {
		if (i % YIELD_EVERY === 0 && i > 0) {
			progress(i, total);
			await nextTurn();
		}
		const { row, cells: values } = table.records[i]!;
		// Template rows left unfilled carry no reading; a CSV may hold only some of the points.
		if (table.format === 'csv' && !values[readingColumn]) continue;
		const cells = cellsByColumn(table.headers, values);
		const parsed = readingRowSchema.safeParse(cells);
		if (!parsed.success) {
			for (const issue of parsed.error.issues) {
				const column = issue.path.length ? String(issue.path[0]) : null;
				const given = column ? cells[column] : undefined;
				const shown = typeof given === 'string' && given !== '' ? `“${given.slice(0, 40)}” ` : '';
				problems.add(row, column, `${shown}${issue.message}`);
			}
			continue;
		}
		const r = parsed.data;
		const at = locateRow(r, layout, row, problems);
		if (!at) continue;
		checkIdentity(r, at, planes, row, problems);

		const key = at.point * READING_KINDS.length + kindIndex.get(r.kind)!;
		const earlier = firstRowOf.get(key);
		if (earlier !== undefined) {
			problems.add(
				row,
				'kind',
				`point ${at.point} already has a ${r.kind} reading in row ${earlier}`
			);
			continue;
		}
		firstRowOf.set(key, row);

		let gathering = runs.get(at.run.run);
		if (!gathering) {
			gathering = new RunConditionsGathering(at.run.run, row);
			runs.set(at.run.run, gathering);
		}
		gathering.add(r, row, problems);

		const pressure_Pa = rowPressure_Pa(r, row, problems);
		if (pressure_Pa === undefined) continue;
		readings.push({
			point: at.point,
			run: at.run.run,
			kind: r.kind,
			pressure_Pa,
			value: r.reading!,
			unit: r.unit!,
			inclination_deg: r.manometer_inclination_deg ?? null,
			fluidDensity_kgm3: r.manometer_fluid_density ?? null,
			measuredAt: r.time ? new Date(r.time) : null,
			note: r.note ?? null
		});
	}
	progress(total, total);

	const conditions: RunConditions[] = [];
	for (const [, gathering] of [...runs].sort((a, b) => a[0] - b[0])) {
		const c = gathering.conditions(problems);
		if (c) conditions.push(c);
	}
	if (problems.count) return problems.refusal();
	if (readings.length === 0) {
		problems.add(null, 'reading', 'no row has a reading: fill the reading column');
		return problems.refusal();
	}
	return { ok: true, readings, conditions };
}
