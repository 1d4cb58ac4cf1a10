import { CalcInputError, requireInRange, requireNonNegative, requirePositive } from './errors';
import { finding, type Finding } from './findings';
import type { BlockageMethod, SectionKind } from './kinds';

export type { BlockageMethod };

export type TestSection = {
	kind: SectionKind;
	width_m: number;
	height_m: number;
	/** Leg length of the 45° fillet in each of the four corners. */
	cornerFillet_m?: number;
};

export type BlockageLimits = { caution: number; limit: number };

/**
 * Default blockage-ratio limits by kind of section. Closed: about 5 % preferred, up to about
 * 7.5 % with corrections (common practice, no source). Open jets and slotted walls tolerate
 * more (common practice, no source); facilities set their own.
 */
export const DEFAULT_BLOCKAGE_LIMITS: Record<SectionKind, BlockageLimits> = {
	closed: { caution: 0.05, limit: 0.075 },
	slotted: { caution: 0.075, limit: 0.1 },
	open: { caution: 0.1, limit: 0.15 }
};

/** Body-shape factor K for solid blockage: about 0.96 for a body of revolution (Barlow, Rae & Pope, from memory). */
export const DEFAULT_BODY_SHAPE_FACTOR = 0.96;
/** Tunnel-shape factor τ: about 0.86 for a 10:7 rectangular section (Barlow, Rae & Pope, from memory). */
export const DEFAULT_TUNNEL_SHAPE_FACTOR = 0.86;
/** Maskell's θ for three-dimensional bluff bodies: about 5/2 (ARC R&M 3400, 1963, from memory). */
export const MASKELL_THETA_3D = 2.5;

export type BlockageInput = {
	/** How to correct q; chosen, never inferred from which inputs happen to be present. */
	method: BlockageMethod;
	frontalArea_m2: number;
	section: TestSection;
	dragCoefficient?: number;
	modelVolume_m3?: number;
	modelLength_m?: number;
	limits?: BlockageLimits;
	bodyShapeFactor?: number;
	tunnelShapeFactor?: number;
};

export type Blockage = {
	ratio: number;
	/** ΔV/V from the model's volume (or from the catch-all estimate). */
	solidBlockage: number;
	/** ΔV/V from the wake. */
	wakeBlockage: number;
	/** Corrected over uncorrected dynamic pressure, q_c/q_u. */
	dynamicPressureFactor: number;
	method: BlockageMethod;
	sectionArea_m2: number;
	notes: Finding[];
};

const MAX_SECTION_SIDE_M = 1_000;
const MAX_MODEL_VOLUME_M3 = 1e6;

/** Section area less the four 45° corner fillets (each a right triangle of leg f). */
export function sectionArea(section: TestSection): number {
	const width = requireInRange('section.width_m', section.width_m, 0, MAX_SECTION_SIDE_M, {
		openMin: true
	});
	const height = requireInRange('section.height_m', section.height_m, 0, MAX_SECTION_SIDE_M, {
		openMin: true
	});
	const fillet = requireNonNegative('section.cornerFillet_m', section.cornerFillet_m ?? 0);
	if (fillet >= Math.min(width, height) / 2) {
		throw new CalcInputError(
			'section.cornerFillet_m',
			fillet,
			`less than half the smaller side (${Math.min(width, height) / 2} m)`
		);
	}
	return width * height - 2 * fillet * fillet;
}

const pct = (x: number) => `${(x * 100).toFixed(1)} %`;

/**
 * Blockage ratio and the dynamic-pressure correction for a closed section, by the chosen method:
 * - `thom-herriot`: solid blockage ε_sb = K·τ·V/C^1.5 from the model's volume plus wake blockage
 *   ε_wb = C_D·A/(4C) when C_D (frontal-area based) is known, q_c/q_u = (1 + ε_sb + ε_wb)²;
 * - `maskell`: the bluff-body form q_c/q_u = 1 + θ·C_D·A/C;
 * - `catch-all`: Pope's estimate ε = ¼·A/C, q_c/q_u = (1 + ε)²;
 * - `none`: q as measured.
 * (Barlow, Rae & Pope, Low-Speed Wind Tunnel Testing, 3rd ed., and Maskell, ARC R&M 3400.)
 * Open jets and slotted walls need their own corrections (e.g. Mercker & Wiedemann,
 * SAE 960671); none is applied to them here.
 */
export function blockage(x: BlockageInput): Blockage {
	const C = sectionArea(x.section);
	const A = requirePositive('frontalArea_m2', x.frontalArea_m2);
	const ratio = A / C;
	if (ratio >= 1) {
		throw new CalcInputError(
			'frontalArea_m2',
			A,
			`less than the section area (${C.toFixed(3)} m²)`
		);
	}
	const cd =
		x.dragCoefficient === undefined
			? undefined
			: requireInRange('dragCoefficient', x.dragCoefficient, 0, 3);
	const volume =
		x.modelVolume_m3 === undefined
			? undefined
			: requireInRange('modelVolume_m3', x.modelVolume_m3, 0, MAX_MODEL_VOLUME_M3, {
					openMin: true
				});
	if (x.modelLength_m !== undefined) requirePositive('modelLength_m', x.modelLength_m);
	const limits = x.limits ?? DEFAULT_BLOCKAGE_LIMITS[x.section.kind];
	requireInRange('limits.caution', limits.caution, 0, 1);
	requireInRange('limits.limit', limits.limit, limits.caution, 1);

	const notes: Finding[] = [];
	if (ratio > limits.limit) {
		notes.push(
			finding(
				'limit',
				'blockage-over-limit',
				`Blockage ${pct(ratio)} is over the ${pct(limits.limit)} limit for this ${x.section.kind} section.`
			)
		);
	} else if (ratio > limits.caution) {
		notes.push(
			finding(
				'caution',
				'blockage-high',
				`Blockage ${pct(ratio)} is over the ${pct(limits.caution)} preferred for this ${x.section.kind} section; corrections matter.`
			)
		);
	}

	if (x.section.kind !== 'closed') {
		notes.push(
			finding(
				'info',
				'blockage-uncorrected',
				`No dynamic-pressure correction is applied for ${x.section.kind === 'open' ? 'an open jet' : 'a slotted-wall section'}; use the facility's own correction.`
			)
		);
		return {
			ratio,
			solidBlockage: 0,
			wakeBlockage: 0,
			dynamicPressureFactor: 1,
			method: 'none',
			sectionArea_m2: C,
			notes
		};
	}

	if (x.method === 'none') {
		return {
			ratio,
			solidBlockage: 0,
			wakeBlockage: 0,
			dynamicPressureFactor: 1,
			method: 'none',
			sectionArea_m2: C,
			notes
		};
	}
	if (x.method === 'thom-herriot') {
		if (volume === undefined)
			throw new CalcInputError(
				'modelVolume_m3',
				'none',
				'the model volume, which Thom/Herriot needs'
			);
		const K = requirePositive('bodyShapeFactor', x.bodyShapeFactor ?? DEFAULT_BODY_SHAPE_FACTOR);
		const tau = requirePositive(
			'tunnelShapeFactor',
			x.tunnelShapeFactor ?? DEFAULT_TUNNEL_SHAPE_FACTOR
		);
		const solidBlockage = (K * tau * volume) / C ** 1.5;
		const wakeBlockage = cd === undefined ? 0 : (cd * A) / (4 * C);
		if (cd === undefined)
			notes.push(
				finding(
					'info',
					'wake-blockage-omitted',
					'No drag coefficient given: wake blockage is left out.'
				)
			);
		const dynamicPressureFactor = (1 + solidBlockage + wakeBlockage) ** 2;
		return {
			ratio,
			solidBlockage,
			wakeBlockage,
			dynamicPressureFactor,
			method: 'thom-herriot',
			sectionArea_m2: C,
			notes
		};
	}
	if (x.method === 'maskell') {
		if (cd === undefined)
			throw new CalcInputError(
				'dragCoefficient',
				'none',
				"the drag coefficient, which Maskell's correction needs"
			);
		const dynamicPressureFactor = 1 + MASKELL_THETA_3D * cd * ratio;
		// Maskell's factor expressed as the equivalent velocity increment, all from the wake.
		const wakeBlockage = Math.sqrt(dynamicPressureFactor) - 1;
		return {
			ratio,
			solidBlockage: 0,
			wakeBlockage,
			dynamicPressureFactor,
			method: 'maskell',
			sectionArea_m2: C,
			notes
		};
	}
	const solidBlockage = 0.25 * ratio;
	return {
		ratio,
		solidBlockage,
		wakeBlockage: 0,
		dynamicPressureFactor: (1 + solidBlockage) ** 2,
		method: 'catch-all',
		sectionArea_m2: C,
		notes
	};
}
