import {
	blockageCorrectedCp,
	cpDifferenceUncertainty,
	gridAverages,
	matchedDifference,
	pressureCoefficient,
	speedConditions,
	type Finding,
	type Grid
} from '../calc';
import { finding } from '../calc/findings';
import { runConditions } from './conditions';
import type { InstrumentUncertainties, ReductionInput } from './input';
import { emptyGrid, mapGrid, readingsByRun, sameCell, type RunReadings } from './run-grids';
import { distanceTrends, sweeps } from './summaries';
import type { CampaignResults, GridSummary, PlaneRunResult, ReducedPoint } from './types';
import {
	averageCpUncertainty,
	differenceUncertainty,
	matchedMeans,
	pointsUncertainty
} from './uncertainty';
import { wakeDrag } from './wake';

export { KIND_INDEX, type ReadingColumns } from './run-grids';
export type { InstrumentUncertainties, MeasuredConditions, ReductionInput } from './input';

function summarize(grid: Grid, q: number, instrument: InstrumentUncertainties) {
	const averages = gridAverages(grid);
	const counts = {
		rows: new Array<number>(grid.length).fill(0),
		columns: new Array<number>(grid[0]!.length).fill(0)
	};
	grid.forEach((row, i) =>
		row.forEach((v, j) => {
			if (v === null) return;
			counts.rows[i]!++;
			counts.columns[j]!++;
		})
	);
	const rowOrColumn = (average: number | null, n: number) =>
		average === null ? null : pointsUncertainty(average, n, q, instrument);
	return {
		averages,
		uncertainty: {
			average: averageCpUncertainty(averages.plane, averages.count, q, instrument),
			rows: averages.rows.map((a, i) => rowOrColumn(a, counts.rows[i]!)),
			columns: averages.columns.map((a, j) => rowOrColumn(a, counts.columns[j]!))
		}
	};
}

function differenceSummary(
	variant: RunReadings,
	baseline: RunReadings,
	qVariant: number,
	qBaseline: number,
	instrument: InstrumentUncertainties
): (GridSummary & { baselineRun: number; points: Grid }) | null {
	const cpV = mapGrid(variant.gauge, (p) => pressureCoefficient(p, qVariant));
	const cpB = mapGrid(baseline.gauge, (p) => pressureCoefficient(p, qBaseline));
	const hasMatch = cpV.some((row, i) => row.some((v, j) => v !== null && cpB[i]?.[j] != null));
	if (!hasMatch) return null;
	const d = matchedDifference(cpV, cpB);
	const column = (grid: Grid, j: number) => grid.map((row) => [row[j] ?? null]);
	const closed = (v: Grid, b: Grid, average: number | null) => {
		if (average === null) return null;
		const means = matchedMeans(v, b);
		return cpDifferenceUncertainty({
			variantCp: means.variant_Pa / qVariant,
			baselineCp: means.baseline_Pa / qBaseline,
			readings: means.n,
			variantDynamicPressure_Pa: qVariant,
			baselineDynamicPressure_Pa: qBaseline,
			readingUncertainty_Pa: instrument.readingUncertainty_Pa,
			relativeDynamicPressureUncertainty: instrument.referenceQUncertainty,
			dynamicPressureCorrelation: 1
		});
	};
	return {
		baselineRun: baseline.run.run,
		points: d.points,
		average: d.plane,
		rowAverages: d.rows,
		columnAverages: d.columns,
		count: d.count,
		uncertainty: {
			average: differenceUncertainty(
				matchedMeans(variant.gauge, baseline.gauge),
				qVariant,
				qBaseline,
				instrument
			),
			rowAverages: d.rows.map((a, i) => closed([variant.gauge[i]!], [baseline.gauge[i]!], a)),
			columnAverages: d.columns.map((a, j) =>
				closed(column(variant.gauge, j), column(baseline.gauge, j), a)
			)
		}
	};
}

/**
 * Reduces a revision's readings: per traverse Cp at every probe, plane, row and column
 * averages with their uncertainties, wake drag, the run's measured air and flow, differences
 * against the baseline configuration, plane averages against distance with a least-squares
 * trend, and drag against Re with the Re-independence verdict.
 */
export function reduceCampaign(input: ReductionInput): CampaignResults {
	const { plan, layout, instrument } = input;
	const factor = plan.dynamicPressureFactor ?? 1;
	const planned = new Map(speedConditions(plan).map((s) => [s.speed_mps, s]));
	const planes = new Map(plan.planes.map((p) => [p.id, p]));
	const configurations = new Map(input.configurations.map((c) => [c.id, c]));
	const grouped = readingsByRun(layout, input.readings);
	const notes: Finding[] = [];
	const absolute = grouped.reduce((n, r) => n + r.absolute, 0);
	if (absolute)
		notes.push(
			finding(
				'info',
				'absolute-readings-kept',
				`${absolute} absolute reading(s) are stored but not reduced: Cp needs gauge pressures against the free-stream static.`
			)
		);

	const qOf = (rr: RunReadings) => input.conditions.get(rr.run.run)?.referenceDynamicPressure_Pa;
	const baselineOf = (rr: RunReadings) =>
		input.baselineConfigurationId === null ||
		rr.run.configurationId === input.baselineConfigurationId
			? undefined
			: grouped.find(
					(b) => b.run.configurationId === input.baselineConfigurationId && sameCell(b.run, rr.run)
				);

	const runs = grouped.map((rr): PlaneRunResult => {
		const run = rr.run;
		const plane = planes.get(run.planeId)!;
		const configuration = configurations.get(run.configurationId);
		const measured = input.conditions.get(run.run);
		const q = measured?.referenceDynamicPressure_Pa;
		const runNotes: Finding[] = [];
		if (measured && measured.relativeHumidity === null)
			runNotes.push(
				finding(
					'info',
					'dry-air-assumed',
					`Run ${run.run}: no humidity given; the air is taken as dry.`
				)
			);
		const cp =
			q === undefined
				? emptyGrid(run.rows, run.columns)
				: mapGrid(rr.gauge, (p) => pressureCoefficient(p, q));
		const cp0 =
			q === undefined
				? emptyGrid(run.rows, run.columns)
				: mapGrid(rr.total, (p) => pressureCoefficient(p, q));
		const hasStatic = cp.some((row) => row.some((v) => v !== null));
		const summary = q !== undefined && hasStatic ? summarize(cp, q, instrument) : null;
		const points: ReducedPoint[][] = cp.map((row, i) =>
			row.map((c, j) => ({
				point: run.firstPoint + i * run.columns + j,
				row: i + 1,
				column: j + 1,
				y_m: plane.grid.y_m[i]!,
				z_m: plane.grid.z_m[j]!,
				cp: c,
				cpCorrected: c === null ? null : blockageCorrectedCp(c, factor),
				cp0: cp0[i]![j]!,
				uCp: c === null || q === undefined ? null : pointsUncertainty(c, 1, q, instrument)
			}))
		);
		const base = baselineOf(rr);
		const qBase = base && qOf(base);
		return {
			run: run.run,
			configurationId: run.configurationId,
			yaw_deg: run.yaw_deg,
			speed_mps: run.speed_mps,
			planeId: run.planeId,
			repeat: run.repeat,
			planeLabel: input.planeLabels[run.planeId] ?? run.planeId,
			configurationLabel: configuration?.label ?? run.configurationId,
			baseline: configuration?.baseline ?? false,
			downstream_m: plane.downstream_m,
			y_m: plane.grid.y_m,
			z_m: plane.grid.z_m,
			conditions: measured
				? runConditions(
						measured,
						planned.get(run.speed_mps)!,
						input.modelReferenceLength_m,
						instrument
					)
				: null,
			dynamicPressureFactor: factor,
			averageCp: summary?.averages.plane ?? null,
			rowAverageCp: summary?.averages.rows ?? new Array(run.rows).fill(null),
			columnAverageCp: summary?.averages.columns ?? new Array(run.columns).fill(null),
			averageCpCorrected: summary ? blockageCorrectedCp(summary.averages.plane, factor) : null,
			count: summary?.averages.count ?? 0,
			uncertainty: {
				averageCp: summary?.uncertainty.average ?? null,
				rowAverageCp: summary?.uncertainty.rows ?? new Array(run.rows).fill(null),
				columnAverageCp: summary?.uncertainty.columns ?? new Array(run.columns).fill(null)
			},
			points,
			wake:
				q === undefined
					? null
					: wakeDrag(rr, plane.grid.y_m, plane.grid.z_m, q, input.referenceArea_m2, instrument),
			difference:
				base && q !== undefined && qBase !== undefined
					? differenceSummary(rr, base, q, qBase, instrument)
					: null,
			notes: runNotes
		};
	});

	return {
		revision: input.revision,
		baselineConfigurationId: input.baselineConfigurationId,
		modelReferenceLength_m: input.modelReferenceLength_m,
		referenceArea_m2: input.referenceArea_m2,
		runs,
		trends: distanceTrends(runs),
		sweeps: sweeps(runs, input.tolerance),
		instrumentUncertainties: instrument,
		notes
	};
}
