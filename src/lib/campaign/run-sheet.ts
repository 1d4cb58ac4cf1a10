import {
	runLayout,
	type FacilityTiming,
	type MatrixPlan,
	type PlannedRun,
	type RunIdentity
} from '../calc';

export type RunSheetLine = RunIdentity & {
	points: number;
	/** Tunnel time from the start of the campaign when this traverse begins. */
	start_s: number;
	/** What happens before the traverse: model change, yaw change, settling. */
	before: ('model change' | 'yaw change' | 'settling')[];
};

/**
 * The runs in order with the elapsed time at each start, following the same sequence and
 * times as estimateOccupancy: set-up first, a model change between configurations, a yaw
 * change between yaw angles, settling at every speed, then a move and a dwell at every point.
 */
export function runSheet(
	plan: MatrixPlan,
	timing: FacilityTiming
): { lines: RunSheetLine[]; end_s: number } {
	const lines: RunSheetLine[] = [];
	let t = timing.setUp_s;
	let previous: PlannedRun | undefined;
	for (const r of runLayout(plan).runs) {
		const before: RunSheetLine['before'] = [];
		const newConfiguration = previous && r.configurationId !== previous.configurationId;
		const newYaw = previous && !newConfiguration && r.yaw_deg !== previous.yaw_deg;
		if (newConfiguration) {
			before.push('model change');
			t += timing.modelChange_s;
		}
		if (newYaw) {
			before.push('yaw change');
			t += timing.yawChange_s;
		}
		if (!previous || newConfiguration || newYaw || r.speed_mps !== previous.speed_mps) {
			before.push('settling');
			t += timing.settling_s;
		}
		const points = r.rows * r.columns;
		const { run, configurationId, yaw_deg, speed_mps, planeId, repeat } = r;
		lines.push({
			run,
			configurationId,
			yaw_deg,
			speed_mps,
			planeId,
			repeat,
			points,
			start_s: t,
			before
		});
		t += points * (timing.traverseMove_s + plan.dwellPerPoint_s);
		previous = r;
	}
	return { lines, end_s: t + timing.tearDown_s };
}
