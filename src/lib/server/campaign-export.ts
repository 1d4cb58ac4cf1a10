import { stringify } from 'csv-stringify/sync';
import { CalcInputError, expandMatrix } from '../calc';
import { campaignFigures } from '../campaign/figures';
import type { CampaignDetail } from './campaigns';

export function figuresOf(c: CampaignDetail) {
	return campaignFigures(c.definition, c.model, c.facility);
}

export type FiguresOrProblem =
	{ figures: ReturnType<typeof figuresOf>; problem: null } | { figures: null; problem: string };

/**
 * The campaign's figures, or why they cannot be computed: a facility or model changed since the
 * draft was saved can put it outside what the core accepts.
 */
export function figuresOrProblem(c: CampaignDetail): FiguresOrProblem {
	try {
		return { figures: figuresOf(c), problem: null };
	} catch (thrown) {
		if (!(thrown instanceof CalcInputError)) throw thrown;
		return { figures: null, problem: `The figures cannot be computed: ${thrown.message}` };
	}
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
export function matrixCsv(figures: ReturnType<typeof figuresOf>): string {
	const rows = expandMatrix(figures.plan);
	return stringify(
		rows.map((r) => COLUMNS.map(([key]) => r[key])),
		{ header: true, columns: COLUMNS.map(([, header]) => header) }
	);
}
