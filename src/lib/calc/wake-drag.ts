import { CalcInputError, requireInRange } from './errors';
import { finding, type Finding } from './findings';
import { requireGrid, type Grid } from './grid';

export type WakeSurvey = {
	/** Row positions, strictly increasing. */
	y_m: number[];
	/** Column positions, strictly increasing. */
	z_m: number[];
	/** Static-pressure coefficient (p − p∞)/q∞ at each point, [row][column]; null = no reading. */
	pressureCoefficient: Grid;
	/** Total-pressure coefficient (p0 − p∞)/q∞ at each point, [row][column]; null = no reading. */
	totalPressureCoefficient: Grid;
	referenceArea_m2: number;
};

export type WakeSurveyDrag = {
	dragCoefficient: number;
	/** Area of the rectangle the survey spans. */
	integratedArea_m2: number;
	notes: Finding[];
};

/** An edge point whose integrand exceeds this share of the largest counts as wake (common practice, no source). */
const WAKE_EDGE_SHARE = 0.05;
// Generous bounds: they keep the integral finite; a traverse is metres, a coefficient order one.
const MAX_POSITION_M = 1e5;
const MAX_COEFFICIENT = 1e6;
const MAX_REFERENCE_AREA_M2 = 1e6;

function requireIncreasingAxis(parameter: string, values: number[]): number[] {
	if (!Array.isArray(values) || values.length < 2) {
		throw new CalcInputError(
			parameter,
			`${Array.isArray(values) ? values.length : 0} positions`,
			'at least 2 positions'
		);
	}
	values.forEach((v, k) => {
		requireInRange(`${parameter}[${k}]`, v, -MAX_POSITION_M, MAX_POSITION_M);
		if (k > 0 && v <= values[k - 1]!) {
			throw new CalcInputError(
				`${parameter}[${k}]`,
				v,
				`greater than ${parameter}[${k - 1}] = ${values[k - 1]}`
			);
		}
	});
	return values;
}

function requireSurveyGrid(parameter: string, values: Grid, rows: number, columns: number): Grid {
	const shape = requireGrid(parameter, values);
	if (shape.rows !== rows || shape.columns !== columns) {
		throw new CalcInputError(
			parameter,
			`a ${shape.rows}×${shape.columns} grid`,
			`y_m.length × z_m.length = ${rows}×${columns}`
		);
	}
	values.forEach((row, i) =>
		row.forEach((v, j) => {
			if (v !== null)
				requireInRange(`${parameter}[${i}][${j}]`, v, -MAX_COEFFICIENT, MAX_COEFFICIENT);
		})
	);
	return values;
}

/** Trapezoidal-rule weights for uneven spacing: half of each neighbouring interval. */
const trapezoidWeights = (x: number[]): number[] =>
	x.map((xk, k) => ((x[k + 1] ?? xk) - (x[k - 1] ?? xk)) / 2);

const points = (n: number) => `${n} point${n === 1 ? '' : 's'}`;

/**
 * Drag coefficient from a wake survey by a momentum balance on a control volume (Anderson,
 * *Fundamentals of Aerodynamics*, §2.6, with the static-pressure term kept):
 * C_D = (1/S)·∬ [2·(u/U)·(1 − u/U) − Cp] dA, where (u/U)² = Cp0 − Cp (Bernoulli along the
 * wake's streamlines, flow along the axis). Integrated by the trapezoidal rule over the grid's
 * rectangle, y by rows and z by columns; outside it the flow is taken as free stream.
 */
export function wakeSurveyDrag(x: WakeSurvey): WakeSurveyDrag {
	const y = requireIncreasingAxis('y_m', x.y_m);
	const z = requireIncreasingAxis('z_m', x.z_m);
	const cp = requireSurveyGrid('pressureCoefficient', x.pressureCoefficient, y.length, z.length);
	const cp0 = requireSurveyGrid(
		'totalPressureCoefficient',
		x.totalPressureCoefficient,
		y.length,
		z.length
	);
	const S = requireInRange('referenceArea_m2', x.referenceArea_m2, 0, MAX_REFERENCE_AREA_M2, {
		openMin: true
	});

	let missing = 0;
	let reversed = 0;
	const integrand = cp.map((row, i) =>
		row.map((c, j) => {
			const c0 = cp0[i]![j] ?? null;
			if (c === null || c0 === null) {
				missing += 1;
				return 0;
			}
			const velocityRatioSquared = c0 - c;
			if (velocityRatioSquared < 0) reversed += 1;
			const u = Math.sqrt(Math.max(velocityRatioSquared, 0));
			return 2 * u * (1 - u) - c;
		})
	);

	const wy = trapezoidWeights(y);
	const wz = trapezoidWeights(z);
	const integral = integrand.reduce(
		(sum, row, i) => row.reduce((rowSum, f, j) => rowSum + wy[i]! * wz[j]! * f, sum),
		0
	);
	const dragCoefficient = integral / S;
	if (!Number.isFinite(dragCoefficient)) {
		throw new CalcInputError('referenceArea_m2', S, 'large enough for a finite drag coefficient');
	}

	const notes: Finding[] = [];
	if (reversed > 0) {
		notes.push(
			finding(
				'caution',
				'wake-total-below-static',
				`${points(reversed)} read total pressure below static (Cp0 < Cp) and were taken as u = 0: reversed or steeply angled flow, where the momentum balance is unreliable.`
			)
		);
	}
	if (missing > 0) {
		notes.push(
			finding(
				'caution',
				'wake-missing-readings',
				`${points(missing)} of ${y.length * z.length} had no reading and were taken as free stream.`
			)
		);
	}
	const largest = integrand.reduce((m, row) => row.reduce((n, f) => Math.max(n, f), m), 0);
	const lastRow = y.length - 1;
	const lastColumn = z.length - 1;
	const wakeAtEdge =
		largest > 0 &&
		integrand.some((row, i) =>
			row.some(
				(f, j) =>
					(i === 0 || i === lastRow || j === 0 || j === lastColumn) && f > WAKE_EDGE_SHARE * largest
			)
		);
	if (wakeAtEdge) {
		notes.push(
			finding(
				'caution',
				'wake-at-edge',
				'The wake reaches the edge of the survey: the grid may not enclose it, and the drag may be underestimated.'
			)
		);
	}

	return {
		dragCoefficient,
		integratedArea_m2: (y[lastRow]! - y[0]!) * (z[lastColumn]! - z[0]!),
		notes
	};
}
