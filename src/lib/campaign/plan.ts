import {
	airState,
	blockage,
	isaAtmosphere,
	speedCondition,
	uniformGrid,
	type AirState,
	type Blockage,
	type FacilityEnvelope,
	type FacilityTiming,
	type MatrixPlan,
	type ProbeGrid
} from '../calc';
import {
	DEFAULT_BLOCKAGE_METHOD,
	type BlockageMethod,
	type ModelKind,
	type SectionKind
} from '../calc/kinds';
import type { CampaignDefinition, ProbeGridSpec } from '../schemas/campaign';

/** What a campaign's figures need of its model (full-scale values as stored). */
export type PlanModel = {
	kind: ModelKind;
	scaleDenominator: number;
	fullScaleLength_m: number;
	fullScaleWidth_m: number;
	fullScaleHeight_m: number;
	fullScaleFrontalArea_m2: number;
	referenceLength_m: number;
	dragCoefficient: number | null;
	modelVolume_m3: number | null;
};

/** What a campaign's figures need of its facility. */
export type PlanFacility = FacilityEnvelope &
	FacilityTiming & {
		sectionKind: SectionKind;
		sectionWidth_m: number;
		sectionHeight_m: number;
		cornerFillet_m: number;
		blockageCaution: number;
		blockageLimit: number;
		/** Absent from revisions frozen before facilities kept their own τ. */
		tunnelShapeFactor?: number;
	};

/** A scale model as the campaign editor offers it. */
export type ModelChoice = PlanModel & { id: string; name: string };

/** A facility as the campaign editor offers it, with the values it suggests for the air. */
export type FacilityChoice = PlanFacility & {
	id: string;
	name: string;
	hourlyRate: string;
	currency: string;
	siteAltitude_m: number;
	typicalTemperature_K: number;
	typicalRelativeHumidity: number;
};

export type CampaignPlan = {
	plan: MatrixPlan;
	tunnelAir: AirState;
	fullScaleAir: AirState;
	blockage: Blockage;
	envelope: FacilityEnvelope;
	timing: FacilityTiming;
	modelLength_m: number;
	modelWidth_m: number;
	modelHeight_m: number;
};

/**
 * The blockage method a campaign uses until its owner chooses one: the default for the model's
 * kind, or the general estimate when the model lacks what that method needs (C_D for Maskell,
 * the volume for Thom/Herriot).
 */
export function defaultBlockageMethod(
	model: Pick<PlanModel, 'kind' | 'dragCoefficient' | 'modelVolume_m3'>
): BlockageMethod {
	const method = DEFAULT_BLOCKAGE_METHOD[model.kind];
	if (method === 'maskell' && model.dragCoefficient == null) return 'catch-all';
	if (method === 'thom-herriot' && model.modelVolume_m3 == null) return 'catch-all';
	return method;
}

export function probeGrid(spec: ProbeGridSpec): ProbeGrid {
	return spec.mode === 'uniform'
		? uniformGrid({
				rows: spec.rows,
				columns: spec.columns,
				rowSpacing_m: spec.rowSpacing_m,
				columnSpacing_m: spec.columnSpacing_m,
				firstRow_m: spec.firstRow_m,
				firstColumn_m: spec.firstColumn_m
			})
		: { y_m: spec.y_m, z_m: spec.z_m };
}

/** A plane's downstream distance in metres, given in model lengths or millimetres. */
export function downstreamMetres(
	d: CampaignDefinition['planes'][number]['downstream'],
	modelLength_m: number
): number {
	return d.unit === 'mm' ? d.value / 1000 : d.value * modelLength_m;
}

/** The model-scale length Re is based on. */
export function modelReferenceLength(
	model: Pick<PlanModel, 'referenceLength_m' | 'scaleDenominator'>
) {
	return model.referenceLength_m / model.scaleDenominator;
}

/**
 * The model's Re at any tunnel speed, by the core's computation behind the figures' speed
 * table (the same reference length and tunnel air), for drawing Re against speed.
 */
export function modelReynoldsAt(
	air: CampaignDefinition['air'],
	model: Pick<PlanModel, 'referenceLength_m' | 'scaleDenominator'>
): (speed_mps: number) => number {
	const setting = {
		modelReferenceLength_m: modelReferenceLength(model),
		tunnelAir: tunnelAirOf(air)
	};
	return (speed_mps) => speedCondition(setting, speed_mps).modelRe;
}

export function tunnelAirOf(air: CampaignDefinition['air']): AirState {
	return air.model === 'isa'
		? isaAtmosphere(air.siteAltitude_m, { temperatureOffset_K: air.temperatureOffset_K })
		: airState({
				temperature_K: air.temperature_K,
				pressure_Pa: air.pressure_Pa,
				relativeHumidity: air.relativeHumidity
			});
}

/**
 * Turns a campaign's definition, model and facility into the calculation core's inputs: lengths
 * to model scale, downstream distances to metres, the tunnel air, and the blockage correction
 * that scales every row's q. Throws CalcInputError for values the core refuses.
 */
export function campaignPlan(
	def: CampaignDefinition,
	model: PlanModel,
	facility: PlanFacility
): CampaignPlan {
	const scale = 1 / model.scaleDenominator;
	const modelLength_m = model.fullScaleLength_m * scale;
	const tunnelAir = tunnelAirOf(def.air);
	const correction = blockage({
		method: def.blockageMethod ?? defaultBlockageMethod(model),
		frontalArea_m2: model.fullScaleFrontalArea_m2 * scale * scale,
		section: {
			kind: facility.sectionKind,
			width_m: facility.sectionWidth_m,
			height_m: facility.sectionHeight_m,
			cornerFillet_m: facility.cornerFillet_m
		},
		dragCoefficient: model.dragCoefficient ?? undefined,
		modelVolume_m3: model.modelVolume_m3 ?? undefined,
		modelLength_m,
		limits: { caution: facility.blockageCaution, limit: facility.blockageLimit },
		tunnelShapeFactor: facility.tunnelShapeFactor
	});
	const plan: MatrixPlan = {
		configurations: def.configurations.map((c) => ({ id: c.id, baseline: c.baseline })),
		speeds_mps: def.speeds_mps,
		yawAngles_deg: def.yawAngles_deg,
		planes: def.planes.map((p) => ({
			id: p.id,
			downstream_m: downstreamMetres(p.downstream, modelLength_m),
			grid: probeGrid(p.grid)
		})),
		dwellPerPoint_s: def.dwellPerPoint_s,
		repeats: def.repeats,
		modelReferenceLength_m: modelReferenceLength(model),
		tunnelAir,
		dynamicPressureFactor: correction.dynamicPressureFactor
	};
	return {
		plan,
		tunnelAir,
		fullScaleAir: isaAtmosphere(def.fullScaleAltitude_m),
		blockage: correction,
		envelope: {
			minSpeed_mps: facility.minSpeed_mps,
			maxSpeed_mps: facility.maxSpeed_mps,
			maxDynamicPressure_Pa: facility.maxDynamicPressure_Pa,
			yawMin_deg: facility.yawMin_deg,
			yawMax_deg: facility.yawMax_deg
		},
		timing: {
			settling_s: facility.settling_s,
			traverseMove_s: facility.traverseMove_s,
			yawChange_s: facility.yawChange_s,
			modelChange_s: facility.modelChange_s,
			setUp_s: facility.setUp_s,
			tearDown_s: facility.tearDown_s
		},
		modelLength_m,
		modelWidth_m: model.fullScaleWidth_m * scale,
		modelHeight_m: model.fullScaleHeight_m * scale
	};
}
