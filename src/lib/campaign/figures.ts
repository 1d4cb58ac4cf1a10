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
import { groupFindings } from './finding-groups';
import { campaignPlan, type CampaignPlan, type PlanFacility, type PlanModel } from './plan';

export type SpeedFigures = SpeedCondition & {
	fullScaleRe: number;
	reRatio: number;
	speedForEqualRe_mps: number;
	machAtEqualRe: number;
	/** The envelope check has a limit at this speed (its range, q or Mach). */
	outsideEnvelope: boolean;
};

/** What the figures need of a facility beyond the plan: its rate for the cost. */
export type CostedFacility = PlanFacility & { hourlyRate: string; currency: string };

export type CampaignFigures = CampaignPlan & {
	speeds: SpeedFigures[];
	findings: Finding[];
	occupancy: Occupancy;
	cost: string;
	currency: string;
};

/**
 * Everything a campaign page, export, API or the editor shows about a campaign, from one
 * computation. O(speeds + probe rows and columns), never O(points), so the editor runs it on
 * every edit. Throws CalcInputError for values the core refuses.
 */
export function campaignFigures(
	def: CampaignDefinition,
	model: PlanModel,
	facility: CostedFacility
): CampaignFigures {
	const planned = campaignPlan(def, model, facility);
	const conditions = speedConditions(planned.plan);
	const envelope = envelopeFindings(planned.plan.yawAngles_deg, conditions, planned.envelope);
	const outside = new Set(envelope.flatMap((f) => (f.speed_mps === undefined ? [] : f.speed_mps)));
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
		// Mach is left to the envelope check, which reports it for every speed already.
		findings.push(...s.notes.filter((n) => n.code !== 'mach-compressible'));
		return {
			...condition,
			fullScaleRe: s.fullScaleRe,
			reRatio: s.reRatio,
			speedForEqualRe_mps: s.speedForEqualRe_mps,
			machAtEqualRe: s.machAtEqualRe,
			outsideEnvelope: outside.has(condition.speed_mps)
		};
	});
	findings.push(...envelope);
	const occupancy = estimateOccupancy(planned.plan, planned.timing);
	return {
		...planned,
		speeds,
		findings: groupFindings(findings, speeds),
		occupancy,
		cost: occupancyCost(occupancy.total_s, facility.hourlyRate, facility.currency),
		currency: facility.currency
	};
}

/** What the pictures show of a campaign's figures; a stored revision keeps the same fields. */
export type PictureFigures = {
	blockageRatio: number;
	speeds: SpeedFigures[];
	findings: Finding[];
};

export function pictureFigures(figures: CampaignFigures): PictureFigures {
	return {
		blockageRatio: figures.blockage.ratio,
		speeds: figures.speeds,
		findings: figures.findings
	};
}
