import type { CampaignInput } from '../schemas/campaign';
import { startingGrid } from './defaults';
import type { FacilityChoice, ModelChoice } from './plan';

/*
 * A campaign in ISA sea-level air for tests of the figures' wiring. These are inputs only: the
 * tests check the figures against published values (ISO 2533:1975), never against these.
 */

export const seaLevelModel: ModelChoice = {
	id: 'model',
	name: 'Estate body',
	kind: 'road-vehicle',
	scaleDenominator: 5,
	fullScaleLength_m: 4.4,
	fullScaleWidth_m: 1.8,
	fullScaleHeight_m: 1.5,
	fullScaleFrontalArea_m2: 2.3,
	referenceLength_m: 4.4,
	dragCoefficient: 0.3,
	modelVolume_m3: null
};

export const seaLevelFacility: FacilityChoice = {
	id: 'facility',
	name: 'Closed section',
	sectionKind: 'closed',
	sectionWidth_m: 2.4,
	sectionHeight_m: 1.8,
	cornerFillet_m: 0.15,
	blockageCaution: 0.05,
	blockageLimit: 0.075,
	minSpeed_mps: 5,
	maxSpeed_mps: 60,
	maxDynamicPressure_Pa: 2300,
	yawMin_deg: -20,
	yawMax_deg: 20,
	settling_s: 60,
	traverseMove_s: 4,
	yawChange_s: 45,
	modelChange_s: 1800,
	setUp_s: 10800,
	tearDown_s: 7200,
	hourlyRate: '780.00',
	currency: 'EUR',
	siteAltitude_m: 0,
	typicalTemperature_K: 288.15,
	typicalRelativeHumidity: 0
};

export const seaLevelForm: CampaignInput = {
	name: 'Sea-level check',
	objective: '',
	modelId: 'model',
	facilityId: 'facility',
	air: { model: 'isa', siteAltitude_m: 0, temperatureOffset_K: 0 },
	fullScaleSpeed_mps: 30,
	fullScaleAltitude_m: 0,
	reIndependenceThreshold: null,
	speedUnit: 'm/s',
	configurations: [{ id: 'base', label: 'Baseline', description: '', baseline: true }],
	speeds_mps: [20, 40],
	yawAngles_deg: [0],
	planes: [
		{
			id: 'x1',
			label: '',
			downstream: { value: 1, unit: 'model-lengths' },
			grid: startingGrid()
		}
	],
	dwellPerPoint_s: 10,
	repeats: 1
};
