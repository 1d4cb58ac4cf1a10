import { eq } from 'drizzle-orm';
import type { MeasuredConditions } from '../readings/types';
import type { CampaignResults } from '../results/types';
import { KIND_INDEX, reduceCampaign, type ReductionInput } from '../results/reduce';
import type { SessionUser } from '../roles';
import type { Db } from './db/open';
import { facility } from './db/schema';
import { refuse, type Outcome } from './outcome';
import { currentConditions } from './readings/current';
import { approvedLayoutOf, readableCampaign } from './readings/layout';

/** Re-independence tolerance when none is asked for: 2 % (common practice, no single source). */
export const DEFAULT_SWEEP_TOLERANCE = 0.02;

export type ResultsOptions = { baseline?: string | null; tolerance?: number };

/** The current readings of a revision as columns, sorted by point, without a row object each. */
function readingColumns(db: Db, revisionId: string) {
	const rows = db.$client
		.prepare(
			`select point, case kind when 'static' then ${KIND_INDEX.static} when 'total' then ${KIND_INDEX.total} else ${KIND_INDEX.absolute} end, pressure_pa
			 from reading where revision_id = ? and superseded_by is null order by point`
		)
		.raw(true)
		.all(revisionId) as [number, number, number][];
	const point = new Int32Array(rows.length);
	const kind = new Uint8Array(rows.length);
	const pressure_Pa = new Float64Array(rows.length);
	rows.forEach(([p, k, v], i) => {
		point[i] = p;
		kind[i] = k;
		pressure_Pa[i] = v;
	});
	return { point, kind, pressure_Pa };
}

/**
 * What the reduction of a campaign's approved revision needs, read for a viewer who may read
 * the campaign. Instrument uncertainties are the facility's current settings.
 */
export function reductionInput(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	options: ResultsOptions = {}
): Outcome<{ input: ReductionInput }> {
	const found = readableCampaign(db, viewer, campaignId);
	if (!found.ok) return found;
	const c = found.campaign;
	const approved = approvedLayoutOf(
		db,
		c,
		'The campaign has no approved revision, so no readings to reduce.'
	);
	if (!approved.ok) return approved;
	const { definition, model } = approved.snapshot;
	const baseline =
		options.baseline ?? definition.configurations.find((x) => x.baseline)?.id ?? null;
	if (baseline !== null && !definition.configurations.some((x) => x.id === baseline))
		return refuse(
			'invalid',
			`There is no configuration “${baseline}” in the approved revision.`,
			'baseline'
		);
	const f = db.select().from(facility).where(eq(facility.id, c.facilityId)).get()!;
	const scale = 1 / model.scaleDenominator;
	const conditions = new Map<number, MeasuredConditions>(
		currentConditions(db, approved.revisionId).map((x) => [x.run, x])
	);
	const input: ReductionInput = {
		revision: approved.revisionNumber,
		plan: approved.plan,
		layout: approved.layout,
		configurations: definition.configurations.map((x) => ({
			id: x.id,
			label: x.label,
			baseline: x.baseline
		})),
		planeLabels: Object.fromEntries(definition.planes.map((p) => [p.id, p.label || p.id])),
		modelReferenceLength_m: approved.plan.modelReferenceLength_m,
		referenceArea_m2: model.fullScaleFrontalArea_m2 * scale * scale,
		readings: readingColumns(db, approved.revisionId),
		conditions,
		instrument: {
			readingUncertainty_Pa: f.readingUncertainty_Pa,
			referenceQUncertainty: f.referenceQUncertainty,
			temperatureUncertainty_K: f.temperatureUncertainty_K,
			barometricUncertainty_Pa: f.barometricUncertainty_Pa,
			humidityUncertainty: f.humidityUncertainty
		},
		baselineConfigurationId: baseline,
		tolerance: options.tolerance ?? DEFAULT_SWEEP_TOLERANCE
	};
	return { ok: true, input };
}

/** The reduced results of a campaign's approved revision. */
export function campaignResults(
	db: Db,
	viewer: SessionUser,
	campaignId: string,
	options: ResultsOptions = {}
): Outcome<{ results: CampaignResults }> {
	const read = reductionInput(db, viewer, campaignId, options);
	return read.ok ? { ok: true, results: reduceCampaign(read.input) } : read;
}
