/**
 * The demo scenario: an invented tunnel laboratory, its staff, and two invented client teams.
 * Every name, dimension and figure here is made up for the demo; none is a check value.
 */
import type { Role } from '../src/lib/roles';
import type { CampaignInput } from '../src/lib/schemas/campaign';
import type { DecisionInput } from '../src/lib/schemas/review';
import type { facility, scaleModel } from '../src/lib/server/db/schema';

export const DEMO_PASSWORD = 'steady-flow-demo';

export const STAFF_TEAM = 'Kestrel Ridge Aero Laboratory';
export const CLIENT_TEAMS = ['Alder Motorsport', 'Brightwater Drone Works'] as const;

export type DemoAccount = { email: string; name: string; roles: Role[]; team: string };

export const DEMO_ACCOUNTS: DemoAccount[] = [
	{
		email: 'aero@demo.test',
		name: 'Imogen Vale',
		roles: ['aerodynamicist'],
		team: CLIENT_TEAMS[0]
	},
	{
		email: 'aero2@demo.test',
		name: 'Tomasz Reyes',
		roles: ['aerodynamicist'],
		team: CLIENT_TEAMS[1]
	},
	{ email: 'reviewer@demo.test', name: 'Priya Castellan', roles: ['reviewer'], team: STAFF_TEAM },
	{ email: 'operator@demo.test', name: 'Olle Brandvik', roles: ['operator'], team: STAFF_TEAM },
	{ email: 'admin@demo.test', name: 'Agnes Thorley', roles: ['admin'], team: STAFF_TEAM }
];

type FacilityRow = Omit<typeof facility.$inferInsert, 'id' | 'createdAt'>;

const WEEKDAYS = (open: string, close: string, days = ['mon', 'tue', 'wed', 'thu', 'fri']) =>
	Object.fromEntries(days.map((d) => [d, [open, close] as [string, string]]));

export const DEMO_FACILITIES: FacilityRow[] = [
	{
		name: 'Tern closed-return tunnel',
		sectionKind: 'closed',
		sectionWidth_m: 2.4,
		sectionHeight_m: 1.8,
		cornerFillet_m: 0.15,
		sectionLength_m: 6.0,
		minSpeed_mps: 5,
		maxSpeed_mps: 60,
		maxDynamicPressure_Pa: 2300,
		yawMin_deg: -20,
		yawMax_deg: 20,
		blockageCaution: 0.05,
		blockageLimit: 0.075,
		settling_s: 60,
		traverseMove_s: 4,
		yawChange_s: 45,
		modelChange_s: 30 * 60,
		setUp_s: 3 * 3600,
		tearDown_s: 2 * 3600,
		openingHours: WEEKDAYS('07:00', '19:00'),
		timeZone: 'Europe/Berlin',
		hourlyRate: '780.00',
		setUpFee: '1200.00',
		tearDownFee: '600.00',
		minimumCharge: '2500.00',
		taxRate_percent: '19',
		quoteValidity_days: 30,
		currency: 'EUR',
		siteAltitude_m: 120,
		typicalTemperature_K: 293.15,
		typicalRelativeHumidity: 0.55
	},
	{
		name: 'Plover open-jet tunnel',
		sectionKind: 'open',
		sectionWidth_m: 1.6,
		sectionHeight_m: 1.2,
		cornerFillet_m: 0,
		sectionLength_m: 3.2,
		minSpeed_mps: 3,
		maxSpeed_mps: 35,
		maxDynamicPressure_Pa: 800,
		yawMin_deg: -30,
		yawMax_deg: 30,
		blockageCaution: 0.1,
		blockageLimit: 0.15,
		settling_s: 40,
		traverseMove_s: 3,
		yawChange_s: 30,
		modelChange_s: 20 * 60,
		setUp_s: 2 * 3600,
		tearDown_s: 90 * 60,
		openingHours: WEEKDAYS('08:00', '17:00', ['mon', 'tue', 'wed', 'thu', 'fri', 'sat']),
		timeZone: 'Europe/Berlin',
		hourlyRate: '420.00',
		setUpFee: '350.00',
		tearDownFee: '250.00',
		minimumCharge: '1500.00',
		taxRate_percent: '19',
		quoteValidity_days: 21,
		currency: 'EUR',
		siteAltitude_m: 120,
		typicalTemperature_K: 291.15,
		typicalRelativeHumidity: 0.6
	}
];

type ModelRow = Omit<typeof scaleModel.$inferInsert, 'id' | 'createdAt' | 'teamId' | 'createdBy'>;

export const DEMO_MODELS: { team: string; owner: string; model: ModelRow }[] = [
	{
		team: CLIENT_TEAMS[0],
		owner: 'aero@demo.test',
		model: {
			name: 'AM-7 sports prototype',
			kind: 'race-car',
			scaleDenominator: 4,
			fullScaleLength_m: 4.62,
			fullScaleWidth_m: 1.96,
			fullScaleHeight_m: 1.04,
			fullScaleFrontalArea_m2: 1.71,
			referenceLength_m: 4.62,
			dragCoefficient: 0.41,
			modelVolume_m3: 0.071
		}
	},
	{
		team: CLIENT_TEAMS[0],
		owner: 'aero@demo.test',
		model: {
			name: 'AM-3 club racer',
			kind: 'road-vehicle',
			scaleDenominator: 5,
			fullScaleLength_m: 3.95,
			fullScaleWidth_m: 1.72,
			fullScaleHeight_m: 1.18,
			fullScaleFrontalArea_m2: 1.78,
			referenceLength_m: 3.95,
			dragCoefficient: 0.36,
			modelVolume_m3: 0.052
		}
	},
	{
		team: CLIENT_TEAMS[1],
		owner: 'aero2@demo.test',
		model: {
			name: 'Heron-4 survey quadcopter',
			kind: 'drone',
			scaleDenominator: 1,
			fullScaleLength_m: 0.56,
			fullScaleWidth_m: 0.56,
			fullScaleHeight_m: 0.19,
			fullScaleFrontalArea_m2: 0.046,
			referenceLength_m: 0.56,
			dragCoefficient: 1.05,
			modelVolume_m3: null
		}
	},
	{
		team: CLIENT_TEAMS[1],
		owner: 'aero2@demo.test',
		model: {
			name: 'Rooftop dock enclosure',
			kind: 'building',
			scaleDenominator: 20,
			fullScaleLength_m: 6.0,
			fullScaleWidth_m: 4.0,
			fullScaleHeight_m: 3.2,
			fullScaleFrontalArea_m2: 12.8,
			referenceLength_m: 3.2,
			dragCoefficient: 1.2,
			modelVolume_m3: 0.0096
		}
	}
];

type CampaignSeed = {
	owner: string;
	model: string;
	facility: string;
	input: Omit<CampaignInput, 'modelId' | 'facilityId'>;
};

const sweep = (from: number, to: number, step: number) =>
	Array.from({ length: Math.round((to - from) / step) + 1 }, (_, i) => from + i * step);

export const DEMO_CAMPAIGNS: CampaignSeed[] = [
	{
		owner: 'aero@demo.test',
		model: 'AM-7 sports prototype',
		facility: 'Tern closed-return tunnel',
		input: {
			name: 'AM-7 rear-wing wake survey',
			objective:
				'Map the wake behind the AM-7 at two downstream planes for the baseline and two rear-wing settings, and check the drag trend for Re-independence across the speed sweep.',
			air: { model: 'isa', siteAltitude_m: 120, temperatureOffset_K: 5 },
			fullScaleSpeed_mps: 55,
			fullScaleAltitude_m: 0,
			reIndependenceThreshold: 2.5e6,
			speedUnit: 'm/s',
			configurations: [
				{
					id: 'base',
					label: 'Baseline',
					description: 'Wing at the homologated setting.',
					baseline: true
				},
				{ id: 'wing-lo', label: 'Wing low', description: 'Main plane −3°.', baseline: false },
				{
					id: 'wing-hi',
					label: 'Wing high',
					description: 'Main plane +4°, Gurney 8 mm.',
					baseline: false
				}
			],
			speeds_mps: [30, 40, 50],
			yawAngles_deg: [-6, -3, 0, 3, 6],
			planes: [
				{
					id: 'x05',
					label: 'Half a length behind',
					downstream: { value: 0.5, unit: 'model-lengths' },
					grid: {
						mode: 'uniform',
						rows: 24,
						columns: 40,
						rowSpacing_m: 0.012,
						columnSpacing_m: 0.015,
						firstRow_m: 0.01,
						firstColumn_m: -0.2925
					}
				},
				{
					id: 'x10',
					label: 'One length behind',
					downstream: { value: 1, unit: 'model-lengths' },
					grid: {
						mode: 'uniform',
						rows: 12,
						columns: 20,
						rowSpacing_m: 0.024,
						columnSpacing_m: 0.03,
						firstRow_m: 0.01,
						firstColumn_m: -0.285
					}
				}
			],
			dwellPerPoint_s: 6,
			repeats: 1
		}
	},
	{
		owner: 'aero@demo.test',
		model: 'AM-3 club racer',
		facility: 'Tern closed-return tunnel',
		input: {
			name: 'AM-3 speed sweep',
			objective:
				'Find where the AM-3’s pressure coefficients stop changing with speed before the aero package is developed.',
			air: { model: 'measured', temperature_K: 291.15, pressure_Pa: 99_800, relativeHumidity: 0.6 },
			fullScaleSpeed_mps: 40,
			fullScaleAltitude_m: 0,
			reIndependenceThreshold: null,
			speedUnit: 'km/h',
			configurations: [
				{ id: 'base', label: 'Baseline', description: 'As delivered.', baseline: true }
			],
			speeds_mps: sweep(15, 55, 5),
			yawAngles_deg: [0],
			planes: [
				{
					id: 'wake',
					label: 'Near wake',
					downstream: { value: 150, unit: 'mm' },
					grid: {
						mode: 'explicit',
						y_m: [0.03, 0.08, 0.13, 0.18],
						z_m: [-0.12, -0.06, 0, 0.06, 0.12]
					}
				}
			],
			dwellPerPoint_s: 15,
			repeats: 1
		}
	},
	{
		owner: 'aero2@demo.test',
		model: 'Heron-4 survey quadcopter',
		facility: 'Plover open-jet tunnel',
		input: {
			name: 'Heron-4 forward-flight wake',
			objective:
				'Survey the rotor wake in forward flight at three airspeeds and two body pitch settings.',
			air: { model: 'isa', siteAltitude_m: 120, temperatureOffset_K: 0 },
			fullScaleSpeed_mps: 12,
			fullScaleAltitude_m: 300,
			reIndependenceThreshold: null,
			speedUnit: 'm/s',
			configurations: [
				{ id: 'level', label: 'Level body', description: 'Body pitch 0°.', baseline: true },
				{ id: 'nose-down', label: 'Nose down', description: 'Body pitch −8°.', baseline: false }
			],
			speeds_mps: [6, 9, 12],
			yawAngles_deg: [0, 15],
			planes: [
				{
					id: 'x1',
					label: 'One span behind',
					downstream: { value: 1, unit: 'model-lengths' },
					grid: {
						mode: 'uniform',
						rows: 10,
						columns: 14,
						rowSpacing_m: 0.04,
						columnSpacing_m: 0.05,
						firstRow_m: 0.1,
						firstColumn_m: -0.325
					}
				}
			],
			dwellPerPoint_s: 8,
			repeats: 1
		}
	},
	{
		owner: 'aero2@demo.test',
		model: 'Rooftop dock enclosure',
		facility: 'Tern closed-return tunnel',
		input: {
			name: 'Dock enclosure roof pressures',
			objective:
				'Mean and peak roof pressures on the dock enclosure for wind from eight directions.',
			air: { model: 'isa', siteAltitude_m: 120, temperatureOffset_K: 0 },
			fullScaleSpeed_mps: 25,
			fullScaleAltitude_m: 0,
			reIndependenceThreshold: 2.7e4,
			speedUnit: 'm/s',
			configurations: [
				{ id: 'bare', label: 'Bare roof', description: 'No parapet.', baseline: true }
			],
			speeds_mps: [12],
			yawAngles_deg: [-20, -10, 0, 10, 20],
			planes: [
				{
					id: 'lee',
					label: 'Leeward',
					downstream: { value: 200, unit: 'mm' },
					grid: {
						mode: 'uniform',
						rows: 6,
						columns: 8,
						rowSpacing_m: 0.02,
						columnSpacing_m: 0.025,
						firstRow_m: 0.02,
						firstColumn_m: -0.0875
					}
				}
			],
			dwellPerPoint_s: 20,
			repeats: 3
		}
	}
];

/** Where the demo's e-mailed links point: the address `npm run demo` serves. */
export const DEMO_ORIGIN = 'http://localhost:3000';

/** The review history the demo starts with: one waiting, one returned with notes, one approved. */
export const DEMO_REVIEW_STORY: {
	campaign: string;
	owner: string;
	decision?: Omit<DecisionInput, 'revision'>;
}[] = [
	{ campaign: 'AM-7 rear-wing wake survey', owner: 'aero@demo.test' },
	{
		campaign: 'AM-3 speed sweep',
		owner: 'aero@demo.test',
		decision: {
			verdict: 'return',
			summary: 'Good sweep, but the top end needs a second look before we book it.',
			notes: [
				{
					anchor: { kind: 'speed', speed_mps: 55 },
					text: 'The wake rake on this plane is cleared to 50 m/s; drop 55 m/s or ask for the stiffened rake.'
				},
				{
					anchor: { kind: 'plane', id: 'wake' },
					text: 'Add a row at 230 mm so the roof shear layer is inside the grid.'
				}
			]
		}
	},
	{
		campaign: 'Heron-4 forward-flight wake',
		owner: 'aero2@demo.test',
		decision: {
			verdict: 'approve',
			summary: 'Fits the open jet comfortably; rotor guards confirmed on the model.',
			notes: []
		}
	}
];

/** The approved demo campaign goes on the calendar, and the open jet has a day of maintenance. */
export const DEMO_BOOKING = {
	campaign: 'Heron-4 forward-flight wake',
	facility: 'Plover open-jet tunnel',
	closure: { kind: 'maintenance' as const, reason: 'Fan bearing inspection', inDays: 6 }
};

/**
 * The approved demo campaign's money: the open jet quoted it and the client accepted before the
 * slots were booked; a first half-day of flow checks ran two weeks ago and is invoiced, unpaid.
 */
export const DEMO_BILLING = {
	campaign: 'Heron-4 forward-flight wake',
	client: 'aero2@demo.test',
	acceptanceNote: 'Accepted for the spring test window.',
	/** The completed slot: Tuesday two weeks back, in the facility's own clock. */
	completed: { weeksAgo: 2, weekday: 2 as const, from: '09:00', to: '13:00' }
};

/** A Gaussian wake in a traverse plane: total-pressure loss and static dip at its centre. */
export type DemoWake = {
	centreY_m: number;
	centreZ_m: number;
	halfWidth_m: number;
	totalPressureLoss: number;
	staticDip: number;
};

/**
 * Invented wake surveys for the approved demo campaign, as the open jet's acquisition computer
 * would send them: the level body and the nose-down variant at 9 and 12 m/s, yaw 0°, static and
 * total readings at every probe. Demo data only, never a check value.
 */
export const DEMO_READINGS = {
	campaign: 'Heron-4 forward-flight wake',
	sender: 'operator@demo.test',
	fileName: 'plover-scanner-heron4.csv',
	airTemperature_C: 16.2,
	barometricPressure_hPa: 1000.4,
	relativeHumidity: 0.58,
	surveys: [
		{
			configuration: 'level',
			yaw_deg: 0,
			speed_mps: 9,
			wake: {
				centreY_m: 0.27,
				centreZ_m: 0,
				halfWidth_m: 0.12,
				totalPressureLoss: 0.34,
				staticDip: 0.05
			}
		},
		{
			configuration: 'level',
			yaw_deg: 0,
			speed_mps: 12,
			wake: {
				centreY_m: 0.28,
				centreZ_m: 0,
				halfWidth_m: 0.115,
				totalPressureLoss: 0.31,
				staticDip: 0.05
			}
		},
		{
			configuration: 'nose-down',
			yaw_deg: 0,
			speed_mps: 9,
			wake: {
				centreY_m: 0.22,
				centreZ_m: 0.01,
				halfWidth_m: 0.13,
				totalPressureLoss: 0.41,
				staticDip: 0.07
			}
		},
		{
			configuration: 'nose-down',
			yaw_deg: 0,
			speed_mps: 12,
			wake: {
				centreY_m: 0.23,
				centreZ_m: 0.01,
				halfWidth_m: 0.125,
				totalPressureLoss: 0.37,
				staticDip: 0.065
			}
		}
	] satisfies { configuration: string; yaw_deg: number; speed_mps: number; wake: DemoWake }[]
};
