import { minorDigits } from './calc/pricing';

const fixedFormats = new Map<number, Intl.NumberFormat>();

/** A figure with a fixed number of decimals, grouped for reading (1 234.5). */
export function fixed(value: number, decimals = 1): string {
	let format = fixedFormats.get(decimals);
	if (!format) {
		format = new Intl.NumberFormat('en-GB', {
			minimumFractionDigits: decimals,
			maximumFractionDigits: decimals
		});
		fixedFormats.set(decimals, format);
	}
	return format.format(value);
}

export function percent(ratio: number, decimals = 1): string {
	return `${fixed(ratio * 100, decimals)} %`;
}

const SECTION_KIND_LABELS = {
	closed: 'Closed',
	open: 'Open jet',
	slotted: 'Slotted wall'
} as const;

export function sectionKindLabel(kind: keyof typeof SECTION_KIND_LABELS): string {
	return SECTION_KIND_LABELS[kind];
}

/** A moment's date as "2026-12-01", in UTC: how quotes, invoices and lists date things. */
export function utcDay(moment: Date | string | number): string {
	return new Date(moment).toISOString().slice(0, 10);
}

/** A moment as "2026-12-01 09:30", in UTC. */
export function utcMinute(moment: Date | string | number): string {
	return new Date(moment).toISOString().slice(0, 16).replace('T', ' ');
}

/**
 * A decimal-string amount with its currency, grouped for reading ("11,733.40 EUR"; a credit
 * "−11,733.40 EUR" with a true minus sign, not a hyphen). Intl formats the string itself, so no
 * digit passes through a binary float.
 */
export function money(amount: string, currency: string): string {
	const digits = minorDigits(currency);
	const format = new Intl.NumberFormat('en-GB', {
		minimumFractionDigits: digits,
		maximumFractionDigits: digits
	});
	const grouped = format.format(amount as Intl.StringNumericLiteral).replace(/^-/, '\u2212');
	return `${grouped} ${currency}`;
}

/** Seconds as hours with two decimals, the way time is billed on a quote or invoice. */
export function billedHours(time_s: number): string {
	return `${fixed(time_s / 3600, 2)} h`;
}
