import type { MatrixPlan, RunLayout } from '../calc';
import type { MeasuredConditions } from '../readings/types';
import type { ReadingColumns } from './run-grids';
import type { CampaignResults } from './types';

export type { MeasuredConditions };

export type InstrumentUncertainties = CampaignResults['instrumentUncertainties'];

export type ReductionInput = {
	revision: number;
	plan: MatrixPlan;
	layout: RunLayout;
	configurations: { id: string; label: string; baseline: boolean }[];
	planeLabels: Record<string, string>;
	modelReferenceLength_m: number;
	/** The model's frontal area, the reference area of the drag coefficient. */
	referenceArea_m2: number;
	readings: ReadingColumns;
	conditions: Map<number, MeasuredConditions>;
	instrument: InstrumentUncertainties;
	baselineConfigurationId: string | null;
	/** Largest relative change between speeds still called Re-independent. */
	tolerance: number;
};
