import Decimal from 'decimal.js';
import { CalcInputError } from './errors';

/** A figure rounded to significant digits for display, as a string (no binary round-off). */
export function toSignificant(value: number, digits = 4): string {
	if (!Number.isFinite(value)) throw new CalcInputError('value', value, 'a finite number');
	return new Decimal(value).toSignificantDigits(digits, Decimal.ROUND_HALF_EVEN).toString();
}
