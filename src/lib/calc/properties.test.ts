import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
	airState,
	blockage,
	BLOCKAGE_METHODS,
	CalcInputError,
	convert,
	dynamicPressure,
	machNumber,
	similarity,
	sutherlandViscosity,
	expandMatrix,
	isaAtmosphere,
	ISA_MAX_ALTITUDE_M,
	ISA_MIN_ALTITUDE_M,
	reynoldsNumber,
	type MatrixPlan
} from './index';

const speed = fc.double({ min: 0.5, max: 100, noNaN: true });
const length = fc.double({ min: 0.01, max: 20, noNaN: true });
const factor = fc.double({ min: 0.1, max: 10, noNaN: true });
const air = isaAtmosphere(0);

describe('properties', () => {
	it('Re is linear in speed and in length', () => {
		fc.assert(
			fc.property(speed, length, factor, (v, l, k) => {
				const re = reynoldsNumber(v, l, air);
				expect(reynoldsNumber(k * v, l, air)).toBeCloseTo(k * re, -Math.log10(re) + 9);
				expect(reynoldsNumber(v, k * l, air)).toBeCloseTo(k * re, -Math.log10(re) + 9);
			})
		);
	});

	it('density falls with altitude through every layer', () => {
		const altitude = fc.double({
			min: ISA_MIN_ALTITUDE_M,
			max: ISA_MAX_ALTITUDE_M - 1,
			noNaN: true
		});
		fc.assert(
			fc.property(altitude, fc.double({ min: 1, max: 5000, noNaN: true }), (h, dh) => {
				const higher = Math.min(h + dh, ISA_MAX_ALTITUDE_M);
				expect(isaAtmosphere(higher).density_kgm3).toBeLessThan(isaAtmosphere(h).density_kgm3);
			})
		);
	});

	it('unit conversions round-trip', () => {
		const pairs: [string, string][] = [
			['mmH2O', 'Pa'],
			['inH2O', 'mmHg'],
			['psi', 'mmH2O'],
			['km/h', 'm/s'],
			['knot', 'mph'],
			['kn', 'm/h'],
			['C', 'K'],
			['ft', 'mm']
		];
		fc.assert(
			fc.property(
				fc.constantFrom(...pairs),
				fc.double({ min: -1e6, max: 1e6, noNaN: true }),
				([a, b], x) => {
					expect(convert(convert(x, a, b), b, a)).toBeCloseTo(x, 6);
				}
			)
		);
	});

	it('the q correction factor is at least 1 for a closed section', () => {
		fc.assert(
			fc.property(
				fc.double({ min: 0.001, max: 0.3, noNaN: true }),
				fc.option(fc.double({ min: 0, max: 2, noNaN: true }), { nil: undefined }),
				fc.option(fc.double({ min: 1e-4, max: 0.5, noNaN: true }), { nil: undefined }),
				fc.constantFrom(...BLOCKAGE_METHODS),
				(ratio, dragCoefficient, modelVolume_m3, method) => {
					if (method === 'maskell' && dragCoefficient === undefined) return;
					if (method === 'thom-herriot' && modelVolume_m3 === undefined) return;
					const b = blockage({
						method,
						frontalArea_m2: ratio * 6,
						section: { kind: 'closed', width_m: 3, height_m: 2 },
						dragCoefficient,
						modelVolume_m3
					});
					expect(b.dynamicPressureFactor).toBeGreaterThanOrEqual(1);
				}
			)
		);
	});

	it('expandMatrix gives the product of the axes', () => {
		const axis = (max: number) =>
			fc.uniqueArray(fc.integer({ min: 1, max: 200 }), { minLength: 1, maxLength: max });
		fc.assert(
			fc.property(
				axis(3),
				axis(4),
				axis(3),
				fc.integer({ min: 1, max: 3 }),
				fc.array(fc.tuple(fc.integer({ min: 1, max: 5 }), fc.integer({ min: 1, max: 5 })), {
					minLength: 1,
					maxLength: 3
				}),
				(configs, speeds, yaws, repeats, grids) => {
					const plan: MatrixPlan = {
						configurations: configs.map((c) => ({ id: `c${c}` })),
						speeds_mps: speeds,
						yawAngles_deg: yaws.map((y) => y - 100),
						planes: grids.map(([r, c], i) => ({
							id: `p${i}`,
							downstream_m: i,
							grid: {
								y_m: Array.from({ length: r }, (_, k) => k),
								z_m: Array.from({ length: c }, (_, k) => k)
							}
						})),
						dwellPerPoint_s: 5,
						repeats,
						modelReferenceLength_m: 1,
						tunnelAir: air
					};
					const points = grids.reduce((n, [r, c]) => n + r * c, 0);
					expect(expandMatrix(plan)).toHaveLength(
						configs.length * speeds.length * yaws.length * points * repeats
					);
				}
			),
			{ numRuns: 50 }
		);
	});
});

describe('no NaN or Infinity escapes', () => {
	const anyNumber = fc.oneof(
		fc.double(),
		fc.constantFrom(NaN, Infinity, -Infinity, 0, -0, 1e308, -1e308)
	);
	const finiteOrRefused = (call: () => unknown) => {
		let out: unknown;
		try {
			out = call();
		} catch (error) {
			expect(error).toBeInstanceOf(CalcInputError);
			return;
		}
		const text = JSON.stringify(out, (_, v) =>
			typeof v === 'number' && !Number.isFinite(v) ? 'NOT-FINITE' : v
		);
		expect(text).not.toContain('NOT-FINITE');
	};

	it('either answers with finite numbers or throws CalcInputError', () => {
		fc.assert(
			fc.property(anyNumber, anyNumber, anyNumber, (a, b, c) => {
				finiteOrRefused(() => isaAtmosphere(a, { temperatureOffset_K: b }));
				finiteOrRefused(() => airState({ temperature_K: a, pressure_Pa: b, relativeHumidity: c }));
				finiteOrRefused(() => reynoldsNumber(a, b, air));
				finiteOrRefused(() => dynamicPressure(a, air));
				finiteOrRefused(() => machNumber(a, air));
				finiteOrRefused(() => sutherlandViscosity(a));
				finiteOrRefused(() => convert(a, 'mmH2O', 'Pa'));
				finiteOrRefused(() =>
					blockage({
						method: 'catch-all',
						frontalArea_m2: a,
						section: { kind: 'closed', width_m: b, height_m: c }
					})
				);
				finiteOrRefused(() =>
					similarity({
						scale: a,
						fullScaleLength_m: b,
						fullScaleSpeed_mps: c,
						modelSpeed_mps: 30,
						fullScaleAir: air,
						tunnelAir: air
					})
				);
			}),
			{ numRuns: 500 }
		);
	});
});
