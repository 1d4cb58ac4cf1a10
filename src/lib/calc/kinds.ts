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
