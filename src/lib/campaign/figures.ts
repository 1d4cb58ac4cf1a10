import {
	envelopeFindings,
	estimateOccupancy,
	occupancyCost,
	similarity,
	speedConditions,
	type Finding,
	type Occupancy,
	type SpeedCondition
} from '../calc';
import type { CampaignDefinition } from '../schemas/campaign';
import { campaignPlan, type CampaignPlan, type PlanFacility, type PlanModel } from './plan';

export type SpeedFigures = SpeedCondition & {
	fullScaleRe: number;
	reRatio: number;
	speedForEqualRe_mps: number;
	machAtEqualRe: number;
};

/**
 * A speed's similarity notes as campaign findings, prefixed with the speed. Mach is left to the
 * envelope check, which reports it once per speed already.
 */
export function speedNotes(speed_mps: number, notes: Finding[]): Finding[] {
	return notes
		.filter((n) => n.code !== 'mach-compressible')
		.map((n) => ({ ...n, message: `${+speed_mps.toFixed(1)} m/s: ${n.message}` }));
}

export type CampaignFigures = CampaignPlan & {
	speeds: SpeedFigures[];
	findings: Finding[];
	occupancy: Occupancy;
	cost: string;
	currency: string;
};

/** Everything a campaign page, export or API shows about a campaign, from one computation. */
export function campaignFigures(
	def: CampaignDefinition,
	model: PlanModel,
	facility: PlanFacility & { hourlyRate: string; currency: string }
): CampaignFigures {
	const planned = campaignPlan(def, model, facility);
	const conditions = speedConditions(planned.plan);
	const findings: Finding[] = [...planned.blockage.notes];
	const speeds = conditions.map((condition) => {
		const s = similarity({
			scale: 1 / model.scaleDenominator,
			fullScaleLength_m: model.referenceLength_m,
			fullScaleSpeed_mps: def.fullScaleSpeed_mps,
			modelSpeed_mps: condition.speed_mps,
			fullScaleAir: planned.fullScaleAir,
			tunnelAir: planned.tunnelAir,
			reIndependenceThreshold: def.reIndependenceThreshold ?? undefined
		});
		findings.push(...speedNotes(condition.speed_mps, s.notes));
		return {
			...condition,
			fullScaleRe: s.fullScaleRe,
			reRatio: s.reRatio,
			speedForEqualRe_mps: s.speedForEqualRe_mps,
			machAtEqualRe: s.machAtEqualRe
		};
	});
	findings.push(...envelopeFindings(planned.plan, planned.envelope, conditions));
	const occupancy = estimateOccupancy(planned.plan, planned.timing);
	return {
		...planned,
		speeds,
		findings,
		occupancy,
		cost: occupancyCost(occupancy.total_s, facility.hourlyRate),
		currency: facility.currency
	};
}
