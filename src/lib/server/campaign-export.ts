import { stringify } from 'csv-stringify/sync';
import { expandMatrix } from '../calc';
import { campaignFigures } from '../campaign/figures';
import type { CampaignDetail } from './campaigns';

export function figuresOf(c: CampaignDetail) {
	return campaignFigures(c.definition, c.model, c.facility);
}

const COLUMNS = [
	['point', 'point'],
	['run', 'run'],
	['configurationId', 'configuration'],
	['yaw_deg', 'yaw_deg'],
	['speed_mps', 'speed_mps'],
	['planeId', 'plane'],
	['downstream_m', 'downstream_m'],
	['repeat', 'repeat'],
	['row', 'row'],
	['column', 'column'],
	['y_m', 'y_m'],
	['z_m', 'z_m'],
	['modelRe', 'model_Re'],
	['dynamicPressure_Pa', 'q_Pa'],
	['dynamicPressure_mmH2O', 'q_mmH2O'],
	['mach', 'Mach'],
	['correctedDynamicPressure_Pa', 'q_corrected_Pa']
] as const;

/** The matrix in run order as CSV, one row per measured point, units in the header names. */
export function matrixCsv(c: CampaignDetail): string {
	const { plan } = figuresOf(c);
	const rows = expandMatrix(plan);
	return stringify(
		rows.map((r) => COLUMNS.map(([key]) => r[key])),
		{ header: true, columns: COLUMNS.map(([, header]) => header) }
	);
}
