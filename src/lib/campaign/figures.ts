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

/** "15, 20 and 25 m/s", or for a longer sweep "15–55 m/s (9 speeds)". */
export function speedList(speeds_mps: number[]): string {
	const sorted = [...new Set(speeds_mps)].sort((a, b) => a - b).map((v) => +v.toFixed(1));
	if (sorted.length > 3) return `${sorted[0]}–${sorted.at(-1)} m/s (${sorted.length} speeds)`;
	if (sorted.length === 1) return `${sorted[0]} m/s`;
	return `${sorted.slice(0, -1).join(', ')} and ${sorted.at(-1)} m/s`;
}

const SEVERITY = { info: 0, caution: 1, limit: 2 } as const;
const range = (xs: number[], digits: number, unit: string) => {
	const lo = Math.min(...xs).toFixed(digits);
	const hi = Math.max(...xs).toFixed(digits);
	return lo === hi ? `${lo} ${unit}` : `${lo}–${hi} ${unit}`;
};
const tail = (message: string, from: string) => message.slice(message.indexOf(from));

/** One sentence for a kind of finding over several speeds, from the speeds' own figures. */
const SUMMARIES: Record<string, (first: Finding, figures: SpeedFigures[], at: number[]) => string> =
	{
		// The equal-Re speed depends on full scale alone, so the first note states it for all.
		're-gap': (first, figures, at) =>
			`Model Re is ${percentRange(figures.map((f) => f.reRatio))} of full scale at ${speedList(at)}. ${tail(first.message, 'Equal Re needs')}`,
		'equal-re-unreachable': (first, figures, at) =>
			`Model Re is ${percentRange(figures.map((f) => f.reRatio))} of full scale at ${speedList(at)}. ${tail(first.message, 'Equal Re needs')}`,
		're-below-independence': (first, figures, at) =>
			`Model Re (${figures.map((f) => f.modelRe.toPrecision(2)).join(', ')}) is ${tail(first.message, 'below')} at ${speedList(at)}`,
		'speed-above-envelope': (first, _, at) =>
			`${speedList(at)} are ${tail(first.message, 'above')}`,
		'speed-below-envelope': (first, _, at) =>
			`${speedList(at)} are ${tail(first.message, 'below')}`,
		'q-above-envelope': (first, figures, at) =>
			`At ${speedList(at)}, q as set reaches ${range(
				figures.map((f) => f.dynamicPressure_Pa),
				0,
				'Pa'
			)}, ${tail(first.message, 'above')}`,
		'mach-compressible': (first, figures, at) =>
			`At ${speedList(at)} the Mach number is ${range(
				figures.map((f) => f.mach),
				2,
				''
			)}`.trim() + `, ${tail(first.message, 'above')}`
	};
const percentRange = (xs: number[]) => {
	const lo = Math.min(...xs) * 100;
	const hi = Math.max(...xs) * 100;
	const f = (x: number) => +x.toPrecision(2);
	return f(lo) === f(hi) ? `${f(lo)} %` : `${f(lo)}–${f(hi)} %`;
};

/**
 * A sweep's per-speed findings as one finding per kind, naming the speeds it applies to and the
 * range of the figure; the per-speed detail stays in the speed table. Findings about no speed
 * pass through as they are.
 */
export function groupFindings(findings: Finding[], speeds: SpeedFigures[]): Finding[] {
	const out: Finding[] = [];
	const groups = new Map<string, Finding[]>();
	for (const f of findings) {
		if (f.speed_mps === undefined) out.push(f);
		else groups.set(f.code, [...(groups.get(f.code) ?? []), f]);
	}
	const bySpeed = new Map(speeds.map((s) => [s.speed_mps, s]));
	for (const [code, group] of groups) {
		const first = group[0]!;
		const level = group.reduce(
			(l, f) => (SEVERITY[f.level] > SEVERITY[l] ? f.level : l),
			first.level
		);
		const at = group.map((f) => f.speed_mps!);
		if (group.length === 1) {
			out.push({ level, code, message: `${speedList(at)}: ${first.message}` });
			continue;
		}
		const figures = at.map((v) => bySpeed.get(v)).filter((f) => f !== undefined);
		const summary =
			figures.length === at.length ? SUMMARIES[code]?.(first, figures, at) : undefined;
		const message = summary ?? `At ${speedList(at)}: ${first.message}`;
		out.push({ level, code, message });
	}
	return out;
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
		// Mach is left to the envelope check, which reports it for every speed already.
		findings.push(...s.notes.filter((n) => n.code !== 'mach-compressible'));
		return {
			...condition,
			fullScaleRe: s.fullScaleRe,
			reRatio: s.reRatio,
			speedForEqualRe_mps: s.speedForEqualRe_mps,
			machAtEqualRe: s.machAtEqualRe
		};
	});
	findings.push(...envelopeFindings(planned.plan, planned.envelope, conditions));
	const grouped = groupFindings(findings, speeds);
	const occupancy = estimateOccupancy(planned.plan, planned.timing);
	return {
		...planned,
		speeds,
		findings: grouped,
		occupancy,
		cost: occupancyCost(occupancy.total_s, facility.hourlyRate),
		currency: facility.currency
	};
}
