import { stringify } from 'csv-stringify/sync';
import type { CampaignResults, PlaneRunResult } from '../results/types';

const HEADER = [
	'level',
	'run',
	'configuration',
	'yaw_deg',
	'speed_mps',
	'plane',
	'downstream_m',
	'repeat',
	'row',
	'column',
	'y_m',
	'z_m',
	'Cp',
	'u_Cp',
	'Cp_corrected',
	'Cp0',
	'delta_Cp_vs_baseline',
	'u_delta_Cp',
	'points_used',
	'q_ref_Pa',
	'air_density_kgm3',
	'measured_speed_mps',
	'achieved_Re',
	'wake_drag_coefficient',
	'u_wake_drag_coefficient'
];

type Line = Partial<Record<(typeof HEADER)[number], unknown>>;

function runLines(r: PlaneRunResult): Line[] {
	const identity = {
		run: r.run,
		configuration: r.configurationId,
		yaw_deg: r.yaw_deg,
		speed_mps: r.speed_mps,
		plane: r.planeId,
		downstream_m: r.downstream_m,
		repeat: r.repeat
	};
	const d = r.difference;
	const lines: Line[] = [
		{
			level: 'plane',
			...identity,
			Cp: r.averageCp,
			u_Cp: r.uncertainty.averageCp,
			Cp_corrected: r.averageCpCorrected,
			delta_Cp_vs_baseline: d?.average,
			u_delta_Cp: d?.uncertainty.average,
			points_used: r.count,
			q_ref_Pa: r.conditions?.referenceDynamicPressure_Pa,
			air_density_kgm3: r.conditions?.density_kgm3,
			measured_speed_mps: r.conditions?.measuredSpeed_mps,
			achieved_Re: r.conditions?.achievedRe,
			wake_drag_coefficient: r.wake?.dragCoefficient,
			u_wake_drag_coefficient: r.wake?.uncertainty
		}
	];
	const averages = (
		level: 'row' | 'column',
		positions: number[],
		cp: (number | null)[],
		u: (number | null)[],
		delta: (number | null)[] | undefined,
		uDelta: (number | null)[] | undefined
	) =>
		cp.forEach((value, k) =>
			lines.push({
				level,
				...identity,
				[level]: k + 1,
				[level === 'row' ? 'y_m' : 'z_m']: positions[k],
				Cp: value,
				u_Cp: u[k],
				delta_Cp_vs_baseline: delta?.[k],
				u_delta_Cp: uDelta?.[k]
			})
		);
	averages(
		'row',
		r.y_m,
		r.rowAverageCp,
		r.uncertainty.rowAverageCp,
		d?.rowAverages,
		d?.uncertainty.rowAverages
	);
	averages(
		'column',
		r.z_m,
		r.columnAverageCp,
		r.uncertainty.columnAverageCp,
		d?.columnAverages,
		d?.uncertainty.columnAverages
	);
	for (const row of r.points)
		for (const p of row)
			lines.push({
				level: 'point',
				...identity,
				row: p.row,
				column: p.column,
				y_m: p.y_m,
				z_m: p.z_m,
				Cp: p.cp,
				u_Cp: p.uCp,
				Cp_corrected: p.cpCorrected,
				Cp0: p.cp0,
				delta_Cp_vs_baseline: d?.points[p.row - 1]?.[p.column - 1]
			});
	return lines;
}

/**
 * Reduced results as CSV: for every traverse its plane average, row and column averages and
 * then every point, `level` saying which. Uncertainties are standard (k = 1); units are in the
 * column names, coefficients have none.
 */
export function resultsCsv(results: CampaignResults): string {
	const lines = results.runs.flatMap(runLines);
	return stringify(
		lines.map((line) => HEADER.map((h) => line[h] ?? '')),
		{ header: true, columns: HEADER }
	);
}
