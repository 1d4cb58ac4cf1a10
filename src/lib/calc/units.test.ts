import convertUnits from 'convert-units';
import { describe, expect, it } from 'vitest';
import { CalcInputError, convert } from './index';

const rel = (actual: number, expected: number) => Math.abs(actual / expected - 1);

describe('conversion factors', () => {
	it('reads m/h as metre per hour, never as mile per hour', () => {
		// NIST SP 811 (2008) B.9: metre per hour is 1/3600 m/s; mile per hour 0.447 04 m/s exactly.
		expect(convert(3600, 'm/h', 'm/s')).toBeCloseTo(1, 12);
		expect(convert(1, 'mph', 'm/h')).toBeCloseTo(0.44704 * 3600, 9);
		// NIST SP 811 (2008) B.9: knot = 1852 m/h exactly.
		expect(convert(1, 'kn', 'm/h')).toBeCloseTo(1852, 9);
	});

	// NIST SP 811 (2008), Appendix B.8 and B.9.
	it.each([
		['mmH2O', 'Pa', 9.80665],
		['inH2O', 'Pa', 249.0889],
		['mmHg', 'Pa', 133.3224],
		['torr', 'Pa', 101325 / 760],
		['psi', 'Pa', 6894.757],
		['knot', 'm/s', 0.5144444],
		['kn', 'm/s', 0.5144444],
		['kt', 'm/s', 0.5144444],
		['mph', 'm/s', 0.44704],
		['mph', 'km/h', 1.609344],
		['km/h', 'm/s', 1 / 3.6]
	])('1 %s = %d %s', (from, to, factor) => {
		expect(rel(convert(1, from, to), factor)).toBeLessThan(1e-6);
	});

	it('converts between the added units and convert-units’ own', () => {
		// 1 inH2O / 1 mmH2O = 249.0889 / 9.80665 (NIST SP 811, B.8); psi via convert-units.
		expect(convert(1, 'inH2O', 'mmH2O')).toBeCloseTo(249.0889 / 9.80665, 10);
		expect(convert(10, 'mmH2O', 'kPa')).toBeCloseTo(0.0980665, 12);
		expect(convert(1, 'psi', 'mmHg')).toBeCloseTo(
			convertUnits(1).from('psi').to('Pa') / 133.3224,
			10
		);
	});

	it('passes plain conversions through convert-units', () => {
		// convert-units 2.3.4 as an independent reference library.
		expect(convert(20, 'C', 'K')).toBe(convertUnits(20).from('C').to('K'));
		expect(convert(1, 'ft', 'm')).toBe(convertUnits(1).from('ft').to('m'));
		expect(convert(1, 'ft2', 'm2')).toBe(convertUnits(1).from('ft2').to('m2'));
	});
});

describe('bad input', () => {
	it('names an unknown unit', () => {
		expect(() => convert(1, 'furlong/fortnight', 'm/s')).toThrow(CalcInputError);
		expect(() => convert(1, 'm/s', 'parsec')).toThrow(/to = parsec/);
	});

	it('refuses to convert between measures', () => {
		expect(() => convert(1, 'mmH2O', 'm/s')).toThrow(/a unit of pressure/);
	});

	it('refuses non-finite values', () => {
		expect(() => convert(NaN, 'Pa', 'mmH2O')).toThrow(/value = NaN/);
	});
});
