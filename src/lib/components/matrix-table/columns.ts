import type { MatrixRow } from '$lib/calc';
import { fixed } from '$lib/format';

export type MatrixColumnId = keyof MatrixRow;

/** Display names for configuration and plane ids; an id without one is shown as itself. */
export type MatrixLabels = {
	configurations?: Record<string, string>;
	planes?: Record<string, string>;
};

export type MatrixColumn = {
	id: MatrixColumnId;
	/** The quantity's name as printed in the header, symbols in their proper case (q, Re, x). */
	name: string;
	unit?: string;
	/** Numbers are right-aligned in the figure font; labels read as text. */
	kind: 'number' | 'label';
	width_rem: number;
	/** Whether the column may be hidden; the point number identifies a row, so it stays. */
	hideable: boolean;
	format: (value: MatrixRow[MatrixColumnId]) => string;
};

export function formatInteger(value: number): string {
	return Number.isFinite(value) ? String(Math.round(value)) : '–';
}

export function formatDecimal(value: number, decimals: number): string {
	return Number.isFinite(value) ? fixed(value, decimals) : '–';
}

/**
 * Reynolds numbers in a tunnel span decades, so they read best as three significant figures with
 * an exponent; "1.53e6" is short, unambiguous next to the Mach column and pastes into a
 * spreadsheet as a number.
 */
export function formatReynolds(value: number): string {
	if (!Number.isFinite(value)) return '–';
	const [mantissa, exponent] = value.toExponential(2).split('e');
	return `${mantissa}e${Number(exponent)}`;
}

export function formatLabel(id: string, labels: Record<string, string> | undefined): string {
	return labels?.[id] ?? id;
}

export function headerText(column: Pick<MatrixColumn, 'name' | 'unit'>): string {
	return column.unit ? `${column.name} (${column.unit})` : column.name;
}

/** A cell's value with its unit, as in a group heading: "25.0 m/s". */
export function formatWithUnit(column: MatrixColumn, value: MatrixRow[MatrixColumnId]): string {
	const text = column.format(value);
	if (!column.unit) return text;
	return column.unit === '°' ? `${text}°` : `${text} ${column.unit}`;
}

type NumberColumnSpec = Omit<MatrixColumn, 'kind' | 'format' | 'hideable'> & {
	format: (value: number) => string;
	hideable?: boolean;
};

function numberColumn(spec: NumberColumnSpec): MatrixColumn {
	const { format, hideable = true, ...rest } = spec;
	return { ...rest, kind: 'number', hideable, format: (value) => format(Number(value)) };
}

function labelColumn(
	id: MatrixColumnId,
	name: string,
	width_rem: number,
	labels: () => Record<string, string> | undefined
): MatrixColumn {
	return {
		id,
		name,
		kind: 'label',
		width_rem,
		hideable: true,
		format: (value) => formatLabel(String(value), labels())
	};
}

const decimals = (n: number) => (value: number) => formatDecimal(value, n);

/**
 * The matrix columns in display order. Labels are read through a function each time a cell is
 * formatted, so a caller holding them in reactive state shows renamed configurations at once.
 */
export function matrixColumns(labels: () => MatrixLabels): MatrixColumn[] {
	return [
		numberColumn({
			id: 'point',
			name: 'Point #',
			width_rem: 6,
			format: formatInteger,
			hideable: false
		}),
		numberColumn({ id: 'run', name: 'Run #', width_rem: 5, format: formatInteger }),
		labelColumn('configurationId', 'Configuration', 10, () => labels().configurations),
		numberColumn({ id: 'yaw_deg', name: 'Yaw', unit: '°', width_rem: 6, format: decimals(1) }),
		numberColumn({
			id: 'speed_mps',
			name: 'Speed',
			unit: 'm/s',
			width_rem: 7.5,
			format: decimals(1)
		}),
		labelColumn('planeId', 'Plane', 8, () => labels().planes),
		numberColumn({
			id: 'downstream_m',
			name: 'x downstream',
			unit: 'm',
			width_rem: 9.5,
			format: decimals(3)
		}),
		numberColumn({ id: 'repeat', name: 'Repeat', width_rem: 5.5, format: formatInteger }),
		numberColumn({ id: 'row', name: 'Row', width_rem: 4.5, format: formatInteger }),
		numberColumn({ id: 'column', name: 'Column', width_rem: 5.5, format: formatInteger }),
		numberColumn({ id: 'y_m', name: 'y', unit: 'm', width_rem: 5.5, format: decimals(3) }),
		numberColumn({ id: 'z_m', name: 'z', unit: 'm', width_rem: 5.5, format: decimals(3) }),
		numberColumn({ id: 'modelRe', name: 'Model Re', width_rem: 6.5, format: formatReynolds }),
		numberColumn({
			id: 'dynamicPressure_Pa',
			name: 'q',
			unit: 'Pa',
			width_rem: 6,
			format: decimals(1)
		}),
		// One mm H₂O is about 9.8 Pa, so two decimals keep the same resolution as the Pa column.
		numberColumn({
			id: 'dynamicPressure_mmH2O',
			name: 'q',
			unit: 'mm H₂O',
			width_rem: 7.5,
			format: decimals(2)
		}),
		numberColumn({ id: 'mach', name: 'Mach', width_rem: 5.5, format: decimals(3) }),
		numberColumn({
			id: 'correctedDynamicPressure_Pa',
			name: 'Corrected q',
			unit: 'Pa',
			width_rem: 9.5,
			format: decimals(1)
		})
	];
}
