import { describe, expect, it } from 'vitest';
import { readingRowSchema } from '../../schemas/readings';
import { ProblemList } from './problems';
import {
	allowedDifference,
	conditionsAgree,
	RUN_CONDITION_TOLERANCES,
	RunConditionsGathering
} from './run-conditions';

const row = (cells: Record<string, string>) =>
	readingRowSchema.parse({
		point: '1',
		kind: 'static',
		reading: '-10',
		unit: 'Pa',
		reference_unit: 'Pa',
		barometric_unit: 'hPa',
		...cells
	});

const stored = {
	referenceDynamicPressure_Pa: 500,
	airTemperature_K: 293.15,
	barometricPressure_Pa: 101_325,
	relativeHumidity: 0.5
};

describe('a run’s reference conditions', () => {
	it('gathers them in SI from the rows that give them', () => {
		const problems = new ProblemList();
		const run = new RunConditionsGathering(4, 2);
		run.add(
			row({
				reference_dynamic_pressure: '500',
				air_temperature_c: '20',
				barometric_pressure: '1013.25',
				relative_humidity: '50%'
			}),
			2,
			problems
		);
		run.add(row({}), 3, problems);
		// T/K = t/°C + 273.15 (SI Brochure, 9th ed., §2.3.1; NIST SP 330 (2019)); 1 hPa = 100 Pa.
		expect(run.conditions(problems)).toEqual({
			run: 4,
			referenceDynamicPressure_Pa: 500,
			airTemperature_K: 293.15,
			barometricPressure_Pa: 101_325,
			relativeHumidity: 0.5
		});
		expect(problems.count).toBe(0);
	});

	it('refuses a run whose rows disagree or that has no reference pressure at all', () => {
		const problems = new ProblemList();
		const run = new RunConditionsGathering(7, 5);
		run.add(row({ air_temperature_c: '20', barometric_pressure: '1000' }), 5, problems);
		run.add(row({ air_temperature_c: '21', barometric_pressure: '1000' }), 6, problems);
		expect(run.conditions(problems)).toBeUndefined();
		expect(problems.shown).toEqual([
			{
				row: 5,
				column: 'reference_dynamic_pressure',
				reason: 'run 7 has no reference dynamic pressure on any of its rows'
			},
			{
				row: 5,
				column: 'air_temperature_c',
				reason: "run 7's rows disagree: 20 to 21 °C, more than 0.5 K apart"
			}
		]);
	});

	it('agrees with stored conditions within the same tolerances the rows are held to', () => {
		const q = stored.referenceDynamicPressure_Pa;
		expect(allowedDifference('dynamicPressure', q)).toBe(
			RUN_CONDITION_TOLERANCES.dynamicPressure * q
		);
		expect(allowedDifference('temperature_K', q)).toBe(RUN_CONDITION_TOLERANCES.temperature_K);
		const within = { ...stored, referenceDynamicPressure_Pa: q * 1.015, airTemperature_K: 293.5 };
		expect(conditionsAgree(within, stored)).toBe(true);
		expect(conditionsAgree({ ...stored, referenceDynamicPressure_Pa: q * 1.03 }, stored)).toBe(
			false
		);
		expect(conditionsAgree({ ...stored, airTemperature_K: 294 }, stored)).toBe(false);
		// Humidity left out on either side is no disagreement.
		expect(conditionsAgree({ ...stored, relativeHumidity: null }, stored)).toBe(true);
		expect(conditionsAgree({ ...stored, relativeHumidity: 0.6 }, stored)).toBe(false);
	});
});
