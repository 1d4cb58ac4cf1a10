/**
 * Which runs the results page shows. The choices offered are those the readings cover; what the
 * user picked is kept apart from them, so that a choice the data no longer offers falls back to a
 * sensible one instead of showing nothing.
 */
import { groupBy } from '$lib/results/grouping';
import type { PlaneRunResult } from '$lib/results/types';

export type Choices = {
	configurations: { id: string; label: string; baseline: boolean }[];
	speeds_mps: number[];
	yaws_deg: number[];
	repeats: number[];
};

export type Selection = {
	configurations: string[];
	speed_mps: number;
	yaw_deg: number;
	repeat: number;
};

const sortedUnique = (values: number[]) => [...new Set(values)].sort((a, b) => a - b);

export function choicesOf(runs: PlaneRunResult[]): Choices {
	return {
		configurations: groupBy(runs, (r) => r.configurationId).map(([r]) => ({
			id: r.configurationId,
			label: r.configurationLabel,
			baseline: r.baseline
		})),
		speeds_mps: sortedUnique(runs.map((r) => r.speed_mps)),
		yaws_deg: sortedUnique(runs.map((r) => r.yaw_deg)),
		repeats: sortedUnique(runs.map((r) => r.repeat))
	};
}

/**
 * The picked selection where the choices still offer it. By default: every configuration, the
 * highest speed (the usual reference condition), the yaw nearest zero and the first repeat.
 */
export function resolveSelection(choices: Choices, picked: Partial<Selection>): Selection {
	const offered = <T>(list: T[], value: T | undefined, fallback: T | undefined) =>
		value !== undefined && list.includes(value) ? value : fallback;
	const nearestZero = [...choices.yaws_deg].sort((a, b) => Math.abs(a) - Math.abs(b))[0];
	const ids = choices.configurations.map((c) => c.id);
	return {
		configurations: picked.configurations
			? picked.configurations.filter((id) => ids.includes(id))
			: ids,
		speed_mps: offered(choices.speeds_mps, picked.speed_mps, choices.speeds_mps.at(-1)) ?? 0,
		yaw_deg: offered(choices.yaws_deg, picked.yaw_deg, nearestZero) ?? 0,
		repeat: offered(choices.repeats, picked.repeat, choices.repeats[0]) ?? 1
	};
}

export function selectedRuns(runs: PlaneRunResult[], s: Selection): PlaneRunResult[] {
	return runs.filter(
		(r) =>
			s.configurations.includes(r.configurationId) &&
			r.speed_mps === s.speed_mps &&
			r.yaw_deg === s.yaw_deg &&
			r.repeat === s.repeat
	);
}

export type PlaneGroup = {
	planeId: string;
	planeLabel: string;
	downstream_m: number;
	runs: PlaneRunResult[];
};

/** Runs gathered by traverse plane, nearest the model first. */
export function byPlane(runs: PlaneRunResult[]): PlaneGroup[] {
	return groupBy(runs, (r) => r.planeId)
		.map((group) => ({
			planeId: group[0].planeId,
			planeLabel: group[0].planeLabel,
			downstream_m: group[0].downstream_m,
			runs: group
		}))
		.sort((a, b) => a.downstream_m - b.downstream_m);
}

export type SettingGroup = { yaw_deg: number; speed_mps: number; runs: PlaneRunResult[] };

/** Runs gathered by yaw and speed, in that order. */
export function byYawAndSpeed(runs: PlaneRunResult[]): SettingGroup[] {
	return groupBy(runs, (r) => `${r.yaw_deg}|${r.speed_mps}`)
		.map((group) => ({ yaw_deg: group[0].yaw_deg, speed_mps: group[0].speed_mps, runs: group }))
		.sort((a, b) => a.yaw_deg - b.yaw_deg || a.speed_mps - b.speed_mps);
}
