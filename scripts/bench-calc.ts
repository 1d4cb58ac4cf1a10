/**
 * Benchmark of the calculation core: expands and evaluates a 100 000-row matrix and compares it
 * with a plain loop over the same formulas written inline here, in the same run.
 * Run with `npm run bench:calc`; figures vary from machine to machine and run to run.
 */
import {
	expandMatrix,
	isaAtmosphere,
	uniformGrid,
	type MatrixPlan,
	type MatrixRow
} from '../src/lib/calc';

const air = isaAtmosphere(120);
const plan: MatrixPlan = {
	configurations: [{ id: 'baseline', baseline: true }, { id: 'variant' }],
	speeds_mps: [20, 30, 40, 50, 60],
	yawAngles_deg: [-10, -5, 0, 5, 10],
	planes: [0.5, 1.0].map((x, i) => ({
		id: `plane-${i + 1}`,
		downstream_m: x,
		grid: uniformGrid({ rows: 50, columns: 20, rowSpacing_m: 0.01, columnSpacing_m: 0.02 })
	})),
	dwellPerPoint_s: 10,
	repeats: 1,
	modelReferenceLength_m: 1.15,
	tunnelAir: air,
	dynamicPressureFactor: 1.021
};

/** The same rows, every formula written out per row: ρVL/μ, ½ρV², q/9.80665, V/a. */
function inlineLoop(p: MatrixPlan): MatrixRow[] {
	const { density_kgm3: rho, dynamicViscosity_Pas: mu, speedOfSound_mps: a } = p.tunnelAir;
	const factor = p.dynamicPressureFactor ?? 1;
	const rows: MatrixRow[] = [];
	let point = 0;
	let run = 0;
	for (const c of p.configurations) {
		for (const yaw of p.yawAngles_deg) {
			for (const v of p.speeds_mps) {
				for (const plane of p.planes) {
					for (let repeat = 1; repeat <= p.repeats; repeat++) {
						run++;
						for (let i = 0; i < plane.grid.y_m.length; i++) {
							for (let j = 0; j < plane.grid.z_m.length; j++) {
								const q = 0.5 * rho * v * v;
								rows.push({
									speed_mps: v,
									modelRe: (rho * v * p.modelReferenceLength_m) / mu,
									dynamicPressure_Pa: q,
									dynamicPressure_mmH2O: q / 9.80665,
									mach: v / a,
									correctedDynamicPressure_Pa: q * factor,
									point: ++point,
									run,
									configurationId: c.id,
									yaw_deg: yaw,
									planeId: plane.id,
									downstream_m: plane.downstream_m,
									repeat,
									row: i + 1,
									column: j + 1,
									y_m: plane.grid.y_m[i]!,
									z_m: plane.grid.z_m[j]!
								});
							}
						}
					}
				}
			}
		}
	}
	return rows;
}

function medianTime(fn: () => unknown, runs: number): number {
	const times: number[] = [];
	for (let i = 0; i < runs; i++) {
		const start = performance.now();
		fn();
		times.push(performance.now() - start);
	}
	times.sort((x, y) => x - y);
	return times[Math.floor(times.length / 2)]!;
}

const gc = (globalThis as { gc?: () => void }).gc;
const collect = () => gc?.();

for (let i = 0; i < 5; i++) {
	expandMatrix(plan);
	inlineLoop(plan);
}
const rowCount = expandMatrix(plan).length;
if (inlineLoop(plan).length !== rowCount)
	throw new Error('The two loops disagree on the row count.');

const RUNS = 15;
const core_ms = medianTime(() => expandMatrix(plan), RUNS);
const inline_ms = medianTime(() => inlineLoop(plan), RUNS);

collect();
const before = process.memoryUsage().heapUsed;
const kept = expandMatrix(plan);
collect();
const heapGrowth_MB = (process.memoryUsage().heapUsed - before) / 1024 / 1024;

console.log(`rows: ${kept.length}`);
console.log(
	`expandMatrix: ${core_ms.toFixed(1)} ms (median of ${RUNS}), ${Math.round(rowCount / (core_ms / 1000)).toLocaleString('en-GB')} rows/s`
);
console.log(`inline loop:  ${inline_ms.toFixed(1)} ms (median of ${RUNS})`);
console.log(`ratio core / inline: ${(core_ms / inline_ms).toFixed(2)} (aim ≤ 1.5)`);
console.log(
	`heap growth holding the rows: ${heapGrowth_MB.toFixed(1)} MB${gc ? '' : ' (run with --expose-gc for a settled figure)'} (aim < 64 MB)`
);
