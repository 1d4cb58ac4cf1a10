import { describe, expect, it } from 'vitest';
import { readingRowSchema } from '../../schemas/readings';
import { ProblemList } from './problems';
import { rowPressure_Pa, toSI } from './row-units';

const row = (cells: Record<string, string>) =>
	readingRowSchema.parse({ point: '1', kind: 'static', ...cells });

/** Standard acceleration of gravity g_n = 9.80665 m/s² (3rd CGPM 1901; NIST SP 330 (2019)). */
const G_N = 9.80665;

describe('a row’s reading in pascals', () => {
	it('converts pressure units by the NIST SP 811 factors', () => {
		const problems = new ProblemList();
		// NIST SP 811 (2008) appendix B.8: inch of water (conventional) = 2.490 889 E+02 Pa.
		expect(rowPressure_Pa(row({ reading: '-2', unit: 'inH2O' }), 2, problems)).toBeCloseTo(
			-498.1778,
			4
		);
		// NIST SP 811 (2008) appendix B.8: millimetre of mercury (conventional) = 1.333 224 E+02 Pa.
		expect(rowPressure_Pa(row({ reading: '3', unit: 'mmHg' }), 2, problems)).toBeCloseTo(
			399.9672,
			4
		);
		// NIST SP 811 (2008) appendix B.8: pound-force per square inch = 6.894 757 E+03 Pa.
		expect(rowPressure_Pa(row({ reading: '0.1', unit: 'psi' }), 2, problems)).toBeCloseTo(
			689.4757,
			3
		);
		expect(problems.count).toBe(0);
	});

	it('turns an inclined manometer column into Δp = ρ g h sin θ', () => {
		const problems = new ProblemList();
		const r = row({
			reading: '120',
			unit: 'mm',
			manometer_inclination_deg: '30',
			manometer_fluid_density: '800'
		});
		// Hydrostatics with g_n: 0.120 m × 800 kg/m³ × 9.80665 m/s² × sin 30°.
		expect(rowPressure_Pa(r, 2, problems)).toBeCloseTo(0.12 * 800 * G_N * 0.5, 9);
		// A vertical tube of water at the conventional 1000 kg/m³ is the conventional mmH2O
		// (NIST SP 811 appendix B.8: 9.806 65 Pa per mm).
		const vertical = row({ reading: '10', unit: 'mm', manometer_inclination_deg: '90' });
		expect(rowPressure_Pa(vertical, 2, problems)).toBeCloseTo(98.0665, 9);
		expect(problems.count).toBe(0);
	});

	it('refuses a length without manometer columns, a pressure with them, and unphysical values', () => {
		const problems = new ProblemList();
		expect(rowPressure_Pa(row({ reading: '12', unit: 'mm' }), 2, problems)).toBeUndefined();
		expect(
			rowPressure_Pa(
				row({ reading: '12', unit: 'Pa', manometer_inclination_deg: '30' }),
				3,
				problems
			)
		).toBeUndefined();
		expect(rowPressure_Pa(row({ reading: '80', unit: 'kPa' }), 4, problems)).toBeUndefined();
		expect(problems.shown.map((p) => [p.row, p.column])).toEqual([
			[2, 'unit'],
			[3, 'unit'],
			[4, 'reading']
		]);
	});

	it('asks the core once per unit and scales every value by that factor', () => {
		// NIST SP 811 (2008) appendix B.9: 1 hPa = 100 Pa, 1 in = 0.0254 m exactly.
		expect(toSI(1013.25, 'hPa', 'Pa')).toBeCloseTo(101325, 9);
		// convert-units derives the inch through the foot, good to about 3 parts in 10⁸.
		expect(toSI(2, 'in', 'm')).toBeCloseTo(0.0508, 8);
	});
});
