import { linearFit, meanWithTypeA, reynoldsSweep, type Finding } from '../calc';
import { finding } from '../calc/findings';
import { groupBy } from './grouping';
import type { DistanceTrend, PlaneRunResult, ReynoldsSweepResult } from './types';

/** Repeats of one traverse combine as a mean with its Type A uncertainty beside the propagated one. */
function combineRepeats(values: { value: number; uncertainty: number }[]) {
	if (values.length === 1) return { value: values[0]!.value, uncertainty: values[0]!.uncertainty };
	const typeA = meanWithTypeA(values.map((v) => v.value));
	const typeB = values.reduce((s, v) => s + v.uncertainty, 0) / values.length;
	return { value: typeA.mean, uncertainty: Math.hypot(typeA.standardUncertainty, typeB) };
}

export function distanceTrends(runs: PlaneRunResult[]): DistanceTrend[] {
	const withAverage = runs.filter((r) => r.averageCp !== null);
	const trends: DistanceTrend[] = [];
	for (const group of groupBy(
		withAverage,
		(r) => `${r.configurationId}|${r.yaw_deg}|${r.speed_mps}`
	)) {
		const first = group[0]!;
		const points = groupBy(group, (r) => r.planeId)
			.map((repeats) => {
				const average = combineRepeats(
					repeats.map((r) => ({ value: r.averageCp!, uncertainty: r.uncertainty.averageCp ?? 0 }))
				);
				const differences = repeats.filter((r) => r.difference?.average != null);
				const difference = differences.length
					? combineRepeats(
							differences.map((r) => ({
								value: r.difference!.average!,
								uncertainty: r.difference!.uncertainty.average ?? 0
							}))
						)
					: null;
				return {
					planeId: repeats[0]!.planeId,
					downstream_m: repeats[0]!.downstream_m,
					averageCp: average.value,
					uncertainty: average.uncertainty,
					difference: difference?.value ?? null,
					differenceUncertainty: difference?.uncertainty ?? null,
					repeats: repeats.length
				};
			})
			.sort((a, b) => a.downstream_m - b.downstream_m);
		const distinctX = new Set(points.map((p) => p.downstream_m)).size;
		trends.push({
			configurationId: first.configurationId,
			configurationLabel: first.configurationLabel,
			baseline: first.baseline,
			yaw_deg: first.yaw_deg,
			speed_mps: first.speed_mps,
			points,
			fit:
				points.length >= 3 && distinctX >= 2
					? linearFit(
							points.map((p) => p.downstream_m),
							points.map((p) => p.averageCp)
						)
					: null
		});
	}
	return trends;
}

export function sweeps(runs: PlaneRunResult[], tolerance: number): ReynoldsSweepResult[] {
	const withDrag = runs.filter((r) => r.wake && r.conditions);
	const result: ReynoldsSweepResult[] = [];
	for (const group of groupBy(withDrag, (r) => `${r.configurationId}|${r.yaw_deg}|${r.planeId}`)) {
		const points = groupBy(group, (r) => String(r.speed_mps))
			.map((repeats) => {
				const drag = combineRepeats(
					repeats.map((r) => ({ value: r.wake!.dragCoefficient, uncertainty: r.wake!.uncertainty }))
				);
				const re = repeats.reduce((s, r) => s + r.conditions!.achievedRe, 0) / repeats.length;
				return {
					re,
					value: drag.value,
					uncertainty: drag.uncertainty,
					speed_mps: repeats[0]!.speed_mps
				};
			})
			.sort((a, b) => a.re - b.re);
		const notes: Finding[] = [];
		if (points.length < 2) continue;
		if (points.length === 2)
			notes.push(
				finding(
					'caution',
					'sweep-two-points',
					'Judged on two speeds only: weak evidence either way.'
				)
			);
		const sweep = reynoldsSweep(points, tolerance);
		const first = group[0]!;
		result.push({
			configurationId: first.configurationId,
			configurationLabel: first.configurationLabel,
			yaw_deg: first.yaw_deg,
			planeId: first.planeId,
			points,
			relativeChanges: sweep.relativeChanges,
			overTolerance: sweep.relativeChanges.map((change) => Math.abs(change) > tolerance),
			tolerance,
			independentFromRe: sweep.independentFromRe,
			notes
		});
	}
	return result;
}
