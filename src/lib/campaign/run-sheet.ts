import type { FacilityTiming, MatrixPlan } from '../calc';

export type RunSheetLine = {
	run: number;
	configurationId: string;
	yaw_deg: number;
	speed_mps: number;
	planeId: string;
	repeat: number;
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
	let run = 0;
	plan.configurations.forEach((configuration, ci) => {
		plan.yawAngles_deg.forEach((yaw_deg, yi) => {
			plan.speeds_mps.forEach((speed_mps, si) => {
				plan.planes.forEach((plane, pi) => {
					const points = plane.grid.y_m.length * plane.grid.z_m.length;
					for (let repeat = 1; repeat <= plan.repeats; repeat++) {
						const before: RunSheetLine['before'] = [];
						const firstOfSpeed = pi === 0 && repeat === 1;
						if (firstOfSpeed && si === 0 && yi === 0 && ci > 0) {
							before.push('model change');
							t += timing.modelChange_s;
						}
						if (firstOfSpeed && si === 0 && yi > 0) {
							before.push('yaw change');
							t += timing.yawChange_s;
						}
						if (firstOfSpeed) {
							before.push('settling');
							t += timing.settling_s;
						}
						lines.push({
							run: ++run,
							configurationId: configuration.id,
							yaw_deg,
							speed_mps,
							planeId: plane.id,
							repeat,
							points,
							start_s: t,
							before
						});
						t += points * (timing.traverseMove_s + plan.dwellPerPoint_s);
					}
				});
			});
		});
	});
	return { lines, end_s: t + timing.tearDown_s };
}
