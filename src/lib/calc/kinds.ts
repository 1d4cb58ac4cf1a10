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
