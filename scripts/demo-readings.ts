import { dynamicPressure, type MatrixPlan, type RunLayout } from '../src/lib/calc';
import { DEMO_READINGS, type DemoWake } from './demo-scenario';

/** A small deterministic scatter, so the demo's readings look measured and stay the same. */
function scatter(seed: number) {
	let s = seed >>> 0;
	return () => {
		s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
		return s / 2 ** 32 - 0.5;
	};
}

const wakeShape = (w: DemoWake, y: number, z: number) =>
	Math.exp(-((y - w.centreY_m) ** 2 + (z - w.centreZ_m) ** 2) / w.halfWidth_m ** 2);

/** The demo's readings file: static and total readings in Pa at every probe of each survey. */
export function demoReadingsCsv(plan: MatrixPlan, layout: RunLayout): string {
	const noise = scatter(7);
	const lines = [
		'point,kind,reading,unit,reference_dynamic_pressure,reference_unit,air_temperature_C,barometric_pressure,barometric_unit,relative_humidity'
	];
	for (const survey of DEMO_READINGS.surveys) {
		const run = layout.runs.find(
			(r) =>
				r.configurationId === survey.configuration &&
				r.yaw_deg === survey.yaw_deg &&
				r.speed_mps === survey.speed_mps &&
				r.repeat === 1
		);
		if (!run) throw new Error(`The demo campaign has no run for ${JSON.stringify(survey)}`);
		const grid = plan.planes.find((p) => p.id === run.planeId)!.grid;
		const q = dynamicPressure(survey.speed_mps, plan.tunnelAir) * (1 + 0.004 * noise());
		const conditions = `${q.toFixed(2)},Pa,${DEMO_READINGS.airTemperature_C},${DEMO_READINGS.barometricPressure_hPa},hPa,${DEMO_READINGS.relativeHumidity}`;
		for (let i = 0; i < run.rows; i++) {
			for (let j = 0; j < run.columns; j++) {
				const point = run.firstPoint + i * run.columns + j;
				const shape = wakeShape(survey.wake, grid.y_m[i]!, grid.z_m[j]!);
				const total = (1 - survey.wake.totalPressureLoss * shape + 0.004 * noise()) * q;
				const staticGauge = (-survey.wake.staticDip * shape + 0.004 * noise()) * q;
				lines.push(`${point},static,${staticGauge.toFixed(2)},Pa,${conditions}`);
				lines.push(`${point},total,${total.toFixed(2)},Pa,${conditions}`);
			}
		}
	}
	return lines.join('\n') + '\n';
}
