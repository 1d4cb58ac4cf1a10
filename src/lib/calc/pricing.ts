import Decimal from 'decimal.js';
import { CalcInputError, requireNonNegative } from './errors';
import type { Occupancy } from './occupancy';

/** A facility's prices as a quote or invoice uses them: decimal strings, never binary floats. */
export type FacilityRates = {
	hourlyRate: string;
	setUpFee: string;
	tearDownFee: string;
	minimumCharge: string;
	/** Tax on the subtotal, in percent (19 for 19 %). */
	taxRate_percent: string;
	/** ISO 4217 code. */
	currency: string;
};

/** Tunnel time charged by the hour: the estimate's breakdown on a quote, slots on an invoice. */
export const TIME_ITEMS = [
	'set-up-and-tear-down-time',
	'configuration-changes',
	'yaw-changes',
	'settling',
	'traverse-moves',
	'dwell',
	'occupied-time'
] as const;
export type TimeItem = (typeof TIME_ITEMS)[number];
export const CHARGE_ITEMS = [
	...TIME_ITEMS,
	'set-up-fee',
	'tear-down-fee',
	'minimum-charge-top-up'
] as const;
export type ChargeItem = (typeof CHARGE_ITEMS)[number];

export type TimeCharge = { item: TimeItem; time_s: number };

/** One priced line: time lines carry their hours and rate, fees only their amount. */
export type PriceLine = {
	item: ChargeItem;
	time_s: number | null;
	unitPrice: string | null;
	amount: string;
};

export type PricedCharges = {
	lines: PriceLine[];
	subtotal: string;
	taxRate_percent: string;
	tax: string;
	total: string;
	currency: string;
};

/**
 * Digits after the decimal point of the currency's minor unit (2 for EUR, 0 for JPY), from the
 * ISO 4217 data the runtime's Intl carries.
 */
export function minorDigits(currency: string): number {
	try {
		return new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions()
			.maximumFractionDigits!;
	} catch {
		throw new CalcInputError('currency', currency, 'an ISO 4217 code such as EUR');
	}
}

function amountOf(name: string, value: string): Decimal {
	let d: Decimal;
	try {
		d = new Decimal(value);
	} catch {
		throw new CalcInputError(name, value, 'a decimal number such as 780.00');
	}
	if (!d.isFinite() || d.isNegative()) throw new CalcInputError(name, value, '0 or more');
	return d;
}

/**
 * Cost of occupied tunnel time: the exact seconds × the hourly rate, rounded half-up to the
 * currency's minor unit once. The estimate's cost and every time line of a quote or invoice.
 */
export function occupancyCost(time_s: number, hourlyRate: string, currency: string): string {
	requireNonNegative('time_s', time_s);
	const digits = minorDigits(currency);
	return new Decimal(time_s)
		.mul(amountOf('hourlyRate', hourlyRate))
		.div(3600)
		.toDecimalPlaces(digits, Decimal.ROUND_HALF_UP)
		.toFixed(digits);
}

/**
 * Prices tunnel time and fees. Rounding rule: every line is rounded half-up to the currency's
 * minor unit, the subtotal is the sum of the rounded lines, the tax is the subtotal times the
 * rate rounded half-up once, and the total is subtotal plus tax. Fees are charged only when
 * `fees` is set; a subtotal under the minimum charge is topped up to it by a line of its own.
 */
export function priceCharges(
	time: readonly TimeCharge[],
	rates: FacilityRates,
	{ fees }: { fees: boolean }
): PricedCharges {
	const digits = minorDigits(rates.currency);
	const round = (d: Decimal) => d.toDecimalPlaces(digits, Decimal.ROUND_HALF_UP);
	const money = (d: Decimal) => d.toFixed(digits);
	const hourly = amountOf('hourlyRate', rates.hourlyRate);
	const taxRate = amountOf('taxRate_percent', rates.taxRate_percent);
	const minimum = amountOf('minimumCharge', rates.minimumCharge);
	const lines: PriceLine[] = [];
	for (const { item, time_s } of time) {
		const amount = occupancyCost(time_s, rates.hourlyRate, rates.currency);
		lines.push({ item, time_s, unitPrice: money(hourly), amount });
	}
	if (fees) {
		for (const [item, value] of [
			['set-up-fee', rates.setUpFee],
			['tear-down-fee', rates.tearDownFee]
		] as const) {
			const amount = round(amountOf(item, value));
			if (!amount.isZero())
				lines.push({ item, time_s: null, unitPrice: null, amount: money(amount) });
		}
	}
	let subtotal = lines.reduce((sum, l) => sum.plus(l.amount), new Decimal(0));
	const shortfall = round(minimum).minus(subtotal);
	if (shortfall.isPositive()) {
		lines.push({
			item: 'minimum-charge-top-up',
			time_s: null,
			unitPrice: null,
			amount: money(shortfall)
		});
		subtotal = subtotal.plus(shortfall);
	}
	const tax = round(subtotal.mul(taxRate).div(100));
	return {
		lines,
		subtotal: money(subtotal),
		taxRate_percent: taxRate.toString(),
		tax: money(tax),
		total: money(subtotal.plus(tax)),
		currency: rates.currency
	};
}

/** The estimate's occupancy as the time lines of a quote, in the order the tunnel spends it. */
export function occupancyTimeCharges(occupancy: Occupancy): TimeCharge[] {
	const b = occupancy.breakdown;
	return [
		{ item: 'set-up-and-tear-down-time', time_s: b.setUpAndTearDown_s },
		{ item: 'configuration-changes', time_s: b.modelChanges_s },
		{ item: 'yaw-changes', time_s: b.yawChanges_s },
		{ item: 'settling', time_s: b.settling_s },
		{ item: 'traverse-moves', time_s: b.traverseMoves_s },
		{ item: 'dwell', time_s: b.dwell_s }
	];
}

/** A credit note's charges: every line and sum of the invoice it cancels, negated. */
export function creditCharges(invoice: PricedCharges): PricedCharges {
	const negate = (amount: string) =>
		new Decimal(amount).neg().toFixed(minorDigits(invoice.currency));
	return {
		...invoice,
		lines: invoice.lines.map((l) => ({ ...l, amount: negate(l.amount) })),
		subtotal: negate(invoice.subtotal),
		tax: negate(invoice.tax),
		total: negate(invoice.total)
	};
}

/** An amount in the currency's minor unit (cents), as payment services take it. */
export function toMinorUnits(amount: string, currency: string): number {
	const minor = new Decimal(amount).mul(new Decimal(10).pow(minorDigits(currency)));
	if (!minor.isInteger()) throw new CalcInputError('amount', amount, 'whole minor units');
	return minor.toNumber();
}

/** Difference of two amounts of one currency, `a − b`, exact. */
export function amountDifference(a: string, b: string, currency: string): string {
	return new Decimal(a).minus(b).toFixed(minorDigits(currency));
}
