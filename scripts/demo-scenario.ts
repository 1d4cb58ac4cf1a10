/**
 * The demo scenario: an invented tunnel laboratory, its staff, and two invented client teams.
 * Every name, dimension and figure here is made up for the demo; none is a check value.
 */
import type { Role } from '../src/lib/roles';
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
