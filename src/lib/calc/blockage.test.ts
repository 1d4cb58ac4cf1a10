import { describe, expect, it } from 'vitest';
import { blockage, CalcInputError, sectionArea } from './index';

const closed = { kind: 'closed' as const, width_m: 2.0, height_m: 1.5 };

describe('section area', () => {
	it('subtracts four 45° corner fillets', () => {
		// Each 45° fillet is a right triangle of leg f: area f²/2, evaluated by hand.
		expect(sectionArea({ ...closed, cornerFillet_m: 0.2 })).toBeCloseTo(3.0 - 4 * 0.02, 12);
	});
});

describe('blockage corrections, closed section', () => {
	it('uses the catch-all estimate when asked', () => {
		// ε = ¼·A/C, q_c/q_u = (1 + ε)² — Barlow, Rae & Pope, 3rd ed. (from memory).
		const b = blockage({ method: 'catch-all', frontalArea_m2: 0.12, section: closed });
		expect(b.ratio).toBeCloseTo(0.04, 12);
		expect(b.method).toBe('catch-all');
		expect(b.solidBlockage).toBeCloseTo(0.01, 12);
		expect(b.dynamicPressureFactor).toBeCloseTo(1.0201, 12);
		expect(b.notes).toEqual([]);
	});

	it('uses Maskell for a bluff body with a drag coefficient', () => {
		// q_c/q_u = 1 + θ·C_D·A/C, θ ≈ 5/2 — Maskell, ARC R&M 3400 (1963) (from memory).
		const b = blockage({
			method: 'maskell',
			frontalArea_m2: 0.15,
			section: closed,
			dragCoefficient: 0.4,
			modelVolume_m3: 0.09
		});
		expect(b.method).toBe('maskell');
		expect(b.dynamicPressureFactor).toBeCloseTo(1 + 2.5 * 0.4 * 0.05, 12);
		expect((1 + b.wakeBlockage) ** 2).toBeCloseTo(b.dynamicPressureFactor, 12);
	});

	it('uses Thom/Herriot solid blockage plus wake blockage with the volume', () => {
		// ε_sb = K·τ·V/C^1.5, ε_wb = C_D·A/(4C), q_c = q_u(1 + ε_sb + ε_wb)² —
		// Barlow, Rae & Pope, 3rd ed. (from memory / secondary sources).
		const b = blockage({
			method: 'thom-herriot',
			frontalArea_m2: 0.15,
			section: closed,
			dragCoefficient: 0.4,
			modelVolume_m3: 0.09,
			tunnelShapeFactor: 0.86,
			bodyShapeFactor: 0.96
		});
		const esb = (0.96 * 0.86 * 0.09) / 3.0 ** 1.5;
		const ewb = (0.4 * 0.15) / (4 * 3.0);
		expect(b.method).toBe('thom-herriot');
		expect(b.solidBlockage).toBeCloseTo(esb, 12);
		expect(b.wakeBlockage).toBeCloseTo(ewb, 12);
		expect(b.dynamicPressureFactor).toBeCloseTo((1 + esb + ewb) ** 2, 12);
	});

	it('never infers the method from the inputs present', () => {
		// The same model with a volume and a C_D: the method chosen decides, not the inputs.
		const model = {
			frontalArea_m2: 0.15,
			section: closed,
			dragCoefficient: 0.4,
			modelVolume_m3: 0.09
		};
		expect(blockage({ ...model, method: 'maskell' }).method).toBe('maskell');
		expect(blockage({ ...model, method: 'catch-all' }).method).toBe('catch-all');
		expect(blockage({ ...model, method: 'none' }).dynamicPressureFactor).toBe(1);
		expect(() => blockage({ method: 'maskell', frontalArea_m2: 0.15, section: closed })).toThrow(
			/dragCoefficient/
		);
		expect(() =>
			blockage({
				method: 'thom-herriot',
				frontalArea_m2: 0.15,
				section: closed,
				dragCoefficient: 0.4
			})
		).toThrow(/modelVolume_m3/);
	});

	it('flags blockage over 5 % as a caution and over 7.5 % as a limit', () => {
		// Closed sections: about 5 % preferred, up to about 7.5 % with corrections (common
		// practice, no source).
		expect(
			blockage({ method: 'catch-all', frontalArea_m2: 0.18, section: closed }).notes.map(
				(n) => n.level
			)
		).toEqual(['caution']);
		expect(
			blockage({ method: 'catch-all', frontalArea_m2: 0.24, section: closed }).notes.map(
				(n) => n.level
			)
		).toEqual(['limit']);
		expect(
			blockage({
				method: 'catch-all',
				frontalArea_m2: 0.24,
				section: closed,
				limits: { caution: 0.08, limit: 0.1 }
			}).notes
		).toEqual([]);
	});
});

describe('open jets and slotted walls', () => {
	it('reports the ratio but applies no closed-wall correction', () => {
		const b = blockage({
			method: 'maskell',
			frontalArea_m2: 0.24,
			section: { ...closed, kind: 'open' },
			dragCoefficient: 0.4
		});
		expect(b.ratio).toBeCloseTo(0.08, 12);
		expect(b.dynamicPressureFactor).toBe(1);
		expect(b.method).toBe('none');
		expect(b.notes.map((n) => n.code)).toEqual(['blockage-uncorrected']);
	});
});

describe('bad input', () => {
	it.each([
		[{ frontalArea_m2: 0, section: closed }, /frontalArea_m2/],
		[{ frontalArea_m2: 3.5, section: closed }, /less than the section area/],
		[{ frontalArea_m2: 0.1, section: { ...closed, width_m: -2 } }, /section.width_m/],
		[{ frontalArea_m2: 0.1, section: { ...closed, cornerFillet_m: 1 } }, /cornerFillet_m/],
		[{ frontalArea_m2: 0.1, section: closed, dragCoefficient: NaN }, /dragCoefficient/],
		[{ frontalArea_m2: 0.1, section: closed, modelVolume_m3: -1 }, /modelVolume_m3/]
	])('refuses %j', (input, message) => {
		expect(() => blockage({ method: 'catch-all', ...input })).toThrow(CalcInputError);
		expect(() => blockage({ method: 'catch-all', ...input })).toThrow(message);
	});
});
