import Decimal from 'decimal.js';
import { CalcInputError, requireNonNegative } from './errors';

/** Cost of tunnel time: hours × hourly rate, in exact decimal arithmetic, to the cent. */
export function occupancyCost(duration_s: number, hourlyRate: string): string {
	requireNonNegative('duration_s', duration_s);
	let rate: Decimal;
	try {
		rate = new Decimal(hourlyRate);
	} catch {
		throw new CalcInputError('hourlyRate', hourlyRate, 'a decimal number such as 780.00');
	}
	if (!rate.isFinite() || rate.isNegative())
		throw new CalcInputError('hourlyRate', hourlyRate, '0 or more');
	return new Decimal(duration_s)
		.div(3600)
		.mul(rate)
		.toDecimalPlaces(2, Decimal.ROUND_HALF_UP)
		.toFixed(2);
}

/** A figure rounded to significant digits for display, as a string (no binary round-off). */
export function toSignificant(value: number, digits = 4): string {
	if (!Number.isFinite(value)) throw new CalcInputError('value', value, 'a finite number');
	return new Decimal(value).toSignificantDigits(digits, Decimal.ROUND_HALF_EVEN).toString();
}
