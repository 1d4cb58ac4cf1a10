import type { CampaignDefinition } from '../schemas/campaign';
import { defaultBlockageMethod, downstreamMetres, type PlanFacility, type PlanModel } from './plan';

/**
 * Bodies for the calculation API that the campaign editor posts while the user types. The
 * core does the work on the server; the editor only shows the answers.
 */
export function tunnelAirRequest(air: CampaignDefinition['air']) {
	return air.model === 'isa'
		? {
				model: 'isa',
				geopotentialAltitude: air.siteAltitude_m,
				temperatureOffset: air.temperatureOffset_K
			}
		: {
				model: 'measured',
				temperature: air.temperature_K,
				pressure: air.pressure_Pa,
				relativeHumidity: air.relativeHumidity
			};
}

export function blockageRequest(def: CampaignDefinition, model: PlanModel, facility: PlanFacility) {
	const scale = 1 / model.scaleDenominator;
	return {
		method: def.blockageMethod ?? defaultBlockageMethod(model),
		frontalArea: model.fullScaleFrontalArea_m2 * scale * scale,
		section: {
			kind: facility.sectionKind,
			width: facility.sectionWidth_m,
			height: facility.sectionHeight_m,
			cornerFillet: facility.cornerFillet_m
		},
		...(model.dragCoefficient == null ? {} : { dragCoefficient: model.dragCoefficient }),
		...(model.modelVolume_m3 == null ? {} : { modelVolume: model.modelVolume_m3 }),
		modelLength: model.fullScaleLength_m * scale,
		limits: { caution: facility.blockageCaution, limit: facility.blockageLimit },
		...(facility.tunnelShapeFactor === undefined
			? {}
			: { tunnelShapeFactor: facility.tunnelShapeFactor })
	};
}

export function similarityRequest(
	def: CampaignDefinition,
	model: PlanModel,
	modelSpeed_mps: number
) {
	return {
		scale: 1 / model.scaleDenominator,
		fullScaleLength: model.referenceLength_m,
		fullScaleSpeed: def.fullScaleSpeed_mps,
		modelSpeed: modelSpeed_mps,
		fullScaleAir: { model: 'isa', geopotentialAltitude: def.fullScaleAltitude_m },
		tunnelAir: tunnelAirRequest(def.air),
		...(def.reIndependenceThreshold ? { reIndependenceThreshold: def.reIndependenceThreshold } : {})
	};
}

/** The whole matrix, asked for its totals and findings only (no rows). */
export function matrixSummaryRequest(
	def: CampaignDefinition,
	model: PlanModel,
	facility: PlanFacility
) {
	const modelLength_m = model.fullScaleLength_m / model.scaleDenominator;
	return {
		configurations: def.configurations.map((c) => ({ id: c.id, baseline: c.baseline })),
		speeds: def.speeds_mps,
		yawAngles_deg: def.yawAngles_deg,
		planes: def.planes.map((p) => ({
			id: p.id,
			downstream: downstreamMetres(p.downstream, modelLength_m),
			grid:
				p.grid.mode === 'uniform'
					? {
							rows: p.grid.rows,
							columns: p.grid.columns,
							rowSpacing: p.grid.rowSpacing_m,
							columnSpacing: p.grid.columnSpacing_m,
							firstRow: p.grid.firstRow_m,
							firstColumn: p.grid.firstColumn_m
						}
					: { y: p.grid.y_m, z: p.grid.z_m }
		})),
		dwellPerPoint: def.dwellPerPoint_s,
		repeats: def.repeats,
		modelReferenceLength: model.referenceLength_m / model.scaleDenominator,
		tunnelAir: tunnelAirRequest(def.air),
		blockage: blockageRequest(def, model, facility),
		envelope: {
			minSpeed: facility.minSpeed_mps,
			maxSpeed: facility.maxSpeed_mps,
			maxDynamicPressure: facility.maxDynamicPressure_Pa,
			yawMin_deg: facility.yawMin_deg,
			yawMax_deg: facility.yawMax_deg
		},
		timing: {
			settling: facility.settling_s,
			traverseMove: facility.traverseMove_s,
			yawChange: facility.yawChange_s,
			modelChange: facility.modelChange_s,
			setUp: facility.setUp_s,
			tearDown: facility.tearDown_s
		},
		offset: 0,
		limit: 0
	};
}
