import { describe, expect, it } from 'vitest';
import {
	formatDecimal,
	formatInteger,
	formatReynolds,
	formatWithUnit,
	headerText,
	matrixColumns,
	type MatrixColumnId,
	type MatrixLabels
} from './columns';
import { fixtureRows } from './matrix-fixture';

const rows = fixtureRows({ rows: 2, columns: 2 });
const columns = matrixColumns(() => ({}));
const column = (id: MatrixColumnId) => columns.find((c) => c.id === id)!;

describe('formatters', () => {
	it('prints Re with three significant figures and a plain exponent', () => {
		expect(formatReynolds(1_530_000)).toBe('1.53e6');
		expect(formatReynolds(987_654)).toBe('9.88e5');
		expect(formatReynolds(12_000_000)).toBe('1.20e7');
		expect(formatReynolds(Number.NaN)).toBe('–');
	});

	it('prints decimals grouped for reading and whole numbers plainly', () => {
		expect(formatDecimal(1234.56, 1)).toBe('1,234.6');
		expect(formatDecimal(0.07346, 3)).toBe('0.073');
		expect(formatDecimal(Number.POSITIVE_INFINITY, 1)).toBe('–');
		expect(formatInteger(50_000)).toBe('50000');
	});
});

describe('matrixColumns', () => {
	it('shows every quantity of a matrix row exactly once', () => {
		const ids = columns.map((c) => c.id);
		expect(new Set(ids).size).toBe(ids.length);
		expect([...ids].sort()).toEqual(Object.keys(rows[0]!).sort());
	});

	it('puts the units in the headers, in display order', () => {
		expect(columns.map(headerText)).toEqual([
			'Point #',
			'Run #',
			'Configuration',
			'Yaw (°)',
			'Speed (m/s)',
			'Plane',
			'x downstream (m)',
			'Repeat',
			'Row',
			'Column',
			'y (m)',
			'z (m)',
			'Model Re',
			'q (Pa)',
			'q (mm H₂O)',
			'Mach',
			'Corrected q (Pa)'
		]);
	});

	it('formats a 25 m/s point in sea-level ISA air (q = ½·1.225·25² = 382.8 Pa)', () => {
		const point = rows.find((r) => r.speed_mps === 25)!;
		const cell = (id: MatrixColumnId) => column(id).format(point[id]);
		expect(cell('speed_mps')).toBe('25.0');
		expect(cell('dynamicPressure_Pa')).toBe('382.8');
		// 382.8125 Pa / 9.80665 Pa per mm H₂O
		expect(cell('dynamicPressure_mmH2O')).toBe('39.04');
		// 25 m/s / 340.29 m/s
		expect(cell('mach')).toBe('0.073');
		// 25 m/s × 1.15 m / 1.4607e-5 m²/s
		expect(cell('modelRe')).toBe('1.97e6');
		expect(cell('downstream_m')).toBe('0.500');
		expect(cell('yaw_deg')).toBe('-10.0');
	});

	it('shows labels for ids that have one, read afresh at every cell', () => {
		const labels: MatrixLabels = { configurations: { spoiler: 'Rear spoiler' } };
		const labelled = matrixColumns(() => labels).find((c) => c.id === 'configurationId')!;
		expect(labelled.format('spoiler')).toBe('Rear spoiler');
		expect(labelled.format('baseline')).toBe('baseline');
		labels.configurations = { spoiler: 'Spoiler, 12° flap' };
		expect(labelled.format('spoiler')).toBe('Spoiler, 12° flap');
	});

	it('keeps the point number visible and lets the rest be hidden', () => {
		expect(columns.filter((c) => !c.hideable).map((c) => c.id)).toEqual(['point']);
	});

	it('writes a value with its unit, the degree sign closed up', () => {
		expect(formatWithUnit(column('speed_mps'), 25)).toBe('25.0 m/s');
		expect(formatWithUnit(column('yaw_deg'), -5)).toBe('-5.0°');
		expect(formatWithUnit(column('planeId'), 'wake-far')).toBe('wake-far');
	});
});
