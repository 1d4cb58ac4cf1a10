/** Thrown for input outside a function's domain; the message names parameter, value and range. */
export class CalcInputError extends Error {
	override readonly name = 'CalcInputError';
	constructor(
		readonly parameter: string,
		readonly value: unknown,
		readonly validRange: string
	) {
		super(`${parameter} = ${String(value)} is outside the valid range: ${validRange}.`);
	}
}

export function requireFinite(parameter: string, value: number): number {
	if (typeof value !== 'number' || !Number.isFinite(value)) {
		throw new CalcInputError(parameter, value, 'a finite number');
	}
	return value;
}

export function requirePositive(parameter: string, value: number): number {
	requireFinite(parameter, value);
	if (value <= 0) throw new CalcInputError(parameter, value, 'greater than 0');
	return value;
}

export function requireNonNegative(parameter: string, value: number): number {
	requireFinite(parameter, value);
	if (value < 0) throw new CalcInputError(parameter, value, '0 or more');
	return value;
}

export function requireInRange(
	parameter: string,
	value: number,
	min: number,
	max: number,
	{ openMin = false }: { openMin?: boolean } = {}
): number {
	requireFinite(parameter, value);
	const belowMin = openMin ? value <= min : value < min;
	if (belowMin || value > max) {
		throw new CalcInputError(parameter, value, `${openMin ? '(' : '['}${min}, ${max}]`);
	}
	return value;
}

export function requireWholeNumber(parameter: string, value: number, min: number): number {
	if (!Number.isInteger(value) || value < min) {
		throw new CalcInputError(parameter, value, `a whole number, ${min} or more`);
	}
	return value;
}
