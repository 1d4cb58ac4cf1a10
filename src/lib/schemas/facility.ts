import { z } from 'zod';
import { DEFAULT_BLOCKAGE_LIMITS, DEFAULT_TUNNEL_SHAPE_FACTOR } from '../calc/blockage';
import { SECTION_KINDS } from '../calc/kinds';

export const WEEKDAYS = ['mon', 'tue', 'wed', 'thu', 'fri', 'sat', 'sun'] as const;
export type Weekday = (typeof WEEKDAYS)[number];

const clock = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, { error: 'Use 24-hour hh:mm.' });
const length_m = (what: string) =>
	z
		.number({ error: `Enter the ${what}.` })
		.positive({ error: `The ${what} must be above 0.` })
		.max(1000);
const seconds = z
	.number()
	.min(0)
	.max(7 * 24 * 3600);

function isTimeZone(zone: string): boolean {
	try {
		new Intl.DateTimeFormat('en', { timeZone: zone });
		return true;
	} catch {
		return false;
	}
}

/**
 * Standard uncertainties (JCGM 100:2008) of a facility's instruments, used when readings are
 * reduced. Starting values only, common practice, no source: each facility sets its own from its
 * calibration certificates.
 */
export const INSTRUMENT_UNCERTAINTY_DEFAULTS = {
	/** One probe reading, in pascals. */
	readingUncertainty_Pa: 1,
	/** The reference dynamic pressure, as a fraction of it. */
	referenceQUncertainty: 0.01,
	temperatureUncertainty_K: 0.2,
	barometricUncertainty_Pa: 50,
	/** Relative humidity, as a fraction (0.03 = 3 % RH). */
	humidityUncertainty: 0.03
} as const;

/** Money as a decimal string with at most two decimals, so it never passes through a float. */
const amount = (example: string) =>
	z
		.string()
		.trim()
		.regex(/^\d{1,7}(\.\d{1,2})?$/, { error: `Enter an amount such as ${example}.` });

const uncertainty = (max: number, fallback: number) => z.number().min(0).max(max).default(fallback);

/**
 * How slot proposals are cut: no proposed slot shorter than `minimumSlot_s`, and every slot on the
 * `slotStep_s` grid of the facility's clock. Starting values, common practice, no source: a slot
 * under an hour hardly pays for a model check and a warm-up run, and tunnel days are planned in
 * quarter hours. Each facility sets its own.
 */
export const SLOT_DEFAULTS = { minimumSlot_s: 3600, slotStep_s: 900 } as const;

/** One schema for the facility form, the JSON API and the database write; SI throughout. */
export const facilitySchema = z
	.object({
		name: z.string().trim().min(1, { error: 'Name the tunnel.' }).max(120),
		sectionKind: z.enum(SECTION_KINDS),
		sectionWidth_m: length_m('section width'),
		sectionHeight_m: length_m('section height'),
		cornerFillet_m: z.number().min(0).max(100),
		sectionLength_m: length_m('section length'),
		minSpeed_mps: z.number().min(0).max(300),
		maxSpeed_mps: z.number().positive().max(300),
		maxDynamicPressure_Pa: z.number().positive().max(100_000),
		yawMin_deg: z.number().min(-180).max(180),
		yawMax_deg: z.number().min(-180).max(180),
		blockageCaution: z.number().min(0).max(1),
		blockageLimit: z.number().min(0).max(1),
		settling_s: seconds,
		traverseMove_s: seconds,
		yawChange_s: seconds,
		modelChange_s: seconds,
		setUp_s: seconds,
		tearDown_s: seconds,
		openingHours: z.partialRecord(z.enum(WEEKDAYS), z.tuple([clock, clock])),
		timeZone: z
			.string()
			.refine(isTimeZone, { error: 'Use an IANA time zone such as Europe/Berlin.' }),
		hourlyRate: amount('780.00'),
		setUpFee: amount('1200.00').default('0.00'),
		tearDownFee: amount('600.00').default('0.00'),
		minimumCharge: amount('2000.00').default('0.00'),
		taxRate_percent: z
			.string()
			.trim()
			.regex(/^\d{1,2}(\.\d{1,2})?$/, { error: 'Enter a percentage such as 19 or 7.5.' })
			.default('0'),
		quoteValidity_days: z.int().min(1).max(365).default(30),
		quoteRequiredForBooking: z.boolean().default(false),
		currency: z
			.string()
			.trim()
			.toUpperCase()
			.regex(/^[A-Z]{3}$/, { error: 'Use a three-letter code such as EUR.' }),
		siteAltitude_m: z.number().min(-500).max(6000),
		typicalTemperature_K: z.number().min(233.15).max(333.15),
		typicalRelativeHumidity: z.number().min(0).max(1),
		/** τ of Thom/Herriot's solid blockage; it depends on the section's width/height ratio. */
		tunnelShapeFactor: z.number().positive().max(2).default(DEFAULT_TUNNEL_SHAPE_FACTOR),
		readingUncertainty_Pa: uncertainty(1000, INSTRUMENT_UNCERTAINTY_DEFAULTS.readingUncertainty_Pa),
		referenceQUncertainty: uncertainty(0.5, INSTRUMENT_UNCERTAINTY_DEFAULTS.referenceQUncertainty),
		temperatureUncertainty_K: uncertainty(
			10,
			INSTRUMENT_UNCERTAINTY_DEFAULTS.temperatureUncertainty_K
		),
		barometricUncertainty_Pa: uncertainty(
			5000,
			INSTRUMENT_UNCERTAINTY_DEFAULTS.barometricUncertainty_Pa
		),
		humidityUncertainty: uncertainty(0.5, INSTRUMENT_UNCERTAINTY_DEFAULTS.humidityUncertainty),
		minimumSlot_s: z
			.number()
			.min(0)
			.max(24 * 3600, { error: 'A slot cannot be longer than a day.' })
			.default(SLOT_DEFAULTS.minimumSlot_s),
		// Whole minutes: slots are shown and entered to the minute, so a step of seconds would
		// propose times the booking form cannot hold.
		slotStep_s: z
			.number()
			.min(60, { error: 'The step must be at least one minute.' })
			.max(24 * 3600, { error: 'The step cannot be longer than a day.' })
			.multipleOf(60, { error: 'Use whole minutes.' })
			.default(SLOT_DEFAULTS.slotStep_s)
	})
	.superRefine((f, ctx) => {
		if (f.minSpeed_mps >= f.maxSpeed_mps)
			ctx.addIssue({
				code: 'custom',
				path: ['maxSpeed_mps'],
				message: 'The maximum speed must be above the minimum.'
			});
		if (f.yawMin_deg > f.yawMax_deg)
			ctx.addIssue({
				code: 'custom',
				path: ['yawMax_deg'],
				message: 'The yaw range ends below where it starts.'
			});
		if (f.blockageCaution > f.blockageLimit)
			ctx.addIssue({
				code: 'custom',
				path: ['blockageLimit'],
				message: 'The limit must be at or above the caution level.'
			});
		if (f.cornerFillet_m * 2 >= Math.min(f.sectionWidth_m, f.sectionHeight_m))
			ctx.addIssue({
				code: 'custom',
				path: ['cornerFillet_m'],
				message: 'The fillets must be less than half the smaller side.'
			});
		for (const [day, hours] of Object.entries(f.openingHours)) {
			if (hours && hours[0] >= hours[1])
				ctx.addIssue({
					code: 'custom',
					path: ['openingHours', day],
					message: 'Closing time must be after opening time.'
				});
		}
	});

export type FacilityInput = z.infer<typeof facilitySchema>;

/** A stored facility as pages list it. */
export type FacilityListing = FacilityInput & { id: string };

/** A new facility's starting values: a closed section with the usual limits for its kind. */
export function facilityDefaults(): FacilityInput {
	const limits = DEFAULT_BLOCKAGE_LIMITS.closed;
	const weekday: [string, string] = ['08:00', '18:00'];
	return {
		name: '',
		sectionKind: 'closed',
		sectionWidth_m: 2,
		sectionHeight_m: 1.5,
		cornerFillet_m: 0,
		sectionLength_m: 5,
		minSpeed_mps: 5,
		maxSpeed_mps: 50,
		maxDynamicPressure_Pa: 1600,
		yawMin_deg: -15,
		yawMax_deg: 15,
		blockageCaution: limits.caution,
		blockageLimit: limits.limit,
		// Planning times: common practice, no source; each facility sets its own.
		settling_s: 60,
		traverseMove_s: 5,
		yawChange_s: 45,
		modelChange_s: 1800,
		setUp_s: 3 * 3600,
		tearDown_s: 2 * 3600,
		openingHours: { mon: weekday, tue: weekday, wed: weekday, thu: weekday, fri: weekday },
		timeZone: 'Europe/Berlin',
		hourlyRate: '500.00',
		setUpFee: '0.00',
		tearDownFee: '0.00',
		minimumCharge: '0.00',
		taxRate_percent: '0',
		quoteValidity_days: 30,
		quoteRequiredForBooking: false,
		currency: 'EUR',
		siteAltitude_m: 0,
		typicalTemperature_K: 293.15,
		typicalRelativeHumidity: 0.5,
		tunnelShapeFactor: DEFAULT_TUNNEL_SHAPE_FACTOR,
		...INSTRUMENT_UNCERTAINTY_DEFAULTS,
		...SLOT_DEFAULTS
	};
}
