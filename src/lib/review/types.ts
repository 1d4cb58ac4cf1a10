import type { Finding, Occupancy } from '../calc';
import type { SpeedFigures } from '../campaign/figures';
import type { PlanFacility, PlanModel } from '../campaign/plan';
import type { CampaignDefinition } from '../schemas/campaign';

/** What a revision freezes: the campaign as submitted and the figures it showed. */
export type RevisionSnapshot = {
	name: string;
	objective: string;
	definition: CampaignDefinition;
	model: PlanModel & { id: string; name: string };
	facility: PlanFacility & { id: string; name: string; hourlyRate: string; currency: string };
	figures: {
		speeds: SpeedFigures[];
		findings: Finding[];
		occupancy: Occupancy;
		cost: string;
		currency: string;
		blockageRatio: number;
		dynamicPressureFactor: number;
	};
};

/** Where a note points: the whole revision, or one value of one axis. */
export type NoteAnchor =
	| { kind: 'general' }
	| { kind: 'configuration'; id: string }
	| { kind: 'speed'; speed_mps: number }
	| { kind: 'yaw'; yaw_deg: number }
	| { kind: 'plane'; id: string };
