/** Kinds of test section; each has its own blockage limits and corrections. */
export const SECTION_KINDS = ['closed', 'open', 'slotted'] as const;
export type SectionKind = (typeof SECTION_KINDS)[number];

/** Kinds of scale model; each has a default Reynolds-independence threshold. */
export const MODEL_KINDS = [
	'road-vehicle',
	'commercial-vehicle',
	'race-car',
	'building',
	'drone',
	'cylinder',
	'other'
] as const;
export type ModelKind = (typeof MODEL_KINDS)[number];

/** Length the Re-independence threshold is based on. */
export type ReferenceBasis = 'length' | 'width' | 'height' | 'diameter';

/**
 * Default Re-independence thresholds by model kind; campaigns set their own. Null where no
 * published threshold is known to us: the user must state one.
 */
export const DEFAULT_RE_INDEPENDENCE: Record<
	ModelKind,
	{ threshold: number; basis: ReferenceBasis; source: string } | null
> = {
	// Wood, SAE 2012-01-2045: width-based Re of 1e6–3e6, 3e6 recommended.
	'commercial-vehicle': { threshold: 3e6, basis: 'width', source: 'Wood, SAE 2012-01-2045' },
	// Cui et al., Building Simulation 2021: sharp-edged buildings, Re_H about 2.7e4.
	building: { threshold: 2.7e4, basis: 'height', source: 'Cui et al., Building Simulation 2021' },
	// Roshko, JFM 1961: circular cylinder C_D steady at about 0.7 above Re 3.5e6.
	cylinder: { threshold: 3.5e6, basis: 'diameter', source: 'Roshko, JFM 1961' },
	'road-vehicle': null,
	'race-car': null,
	drone: null,
	other: null
};

/**
 * Ways to correct the dynamic pressure for a closed section's blockage. `catch-all` is Pope's
 * ε = ¼·A/C when little is known of the model; `thom-herriot` adds solid blockage from the
 * model's volume and wake blockage from its drag; `maskell` corrects bluff bodies with separated
 * wakes from their drag (Barlow, Rae & Pope, Low-Speed Wind Tunnel Testing, 3rd ed., ch. 10;
 * Maskell, ARC R&M 3400, 1963).
 */
export const BLOCKAGE_METHODS = ['catch-all', 'thom-herriot', 'maskell', 'none'] as const;
export type BlockageMethod = (typeof BLOCKAGE_METHODS)[number];

export const BLOCKAGE_METHOD_LABELS: Record<BlockageMethod, { name: string; explanation: string }> =
	{
		'catch-all': {
			name: 'General estimate',
			explanation: "Pope's catch-all ε = ¼·A/C from the frontal area alone."
		},
		'thom-herriot': {
			name: 'Solid and wake blockage',
			explanation:
				'Thom/Herriot solid blockage from the model volume, plus wake blockage from C_D (frontal-area based).'
		},
		maskell: {
			name: 'Bluff-body wake',
			explanation: "Maskell's correction for separated wakes, q_c/q_u = 1 + θ·C_D·A/C with θ ≈ 2.5."
		},
		none: { name: 'No correction', explanation: 'The dynamic pressure is used as measured.' }
	};

/**
 * The method a new campaign starts with, by kind of model: bluff bodies with separated wakes
 * (road and race vehicles, buildings, drones, cylinders) take Maskell's correction, derived for
 * them (ARC R&M 3400); an unknown shape takes the general estimate. Streamlined bodies, where
 * the model's volume dominates, are Thom/Herriot's case (Barlow, Rae & Pope, ch. 10); a user
 * with a volume and C_D chooses it.
 */
export const DEFAULT_BLOCKAGE_METHOD: Record<ModelKind, BlockageMethod> = {
	'road-vehicle': 'maskell',
	'commercial-vehicle': 'maskell',
	'race-car': 'maskell',
	building: 'maskell',
	drone: 'maskell',
	cylinder: 'maskell',
	other: 'catch-all'
};
