import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import {
	CalcInputError,
	creditCharges,
	minorDigits,
	occupancyCost,
	priceCharges,
	toMinorUnits,
	type FacilityRates
} from './index';

const rates = (overrides: Partial<FacilityRates> = {}): FacilityRates => ({
	hourlyRate: '780.00',
	setUpFee: '1200.00',
	tearDownFee: '600.00',
	minimumCharge: '0.00',
	taxRate_percent: '19',
	currency: 'EUR',
	...overrides
});

// The expected figures are worked out here with decimal.js as the reference arithmetic, half-up
// to the cent as the rounding rule says.
const cents = (d: Decimal) => d.toDecimalPlaces(2, Decimal.ROUND_HALF_UP);

describe('pricing tunnel time', () => {
	it('prices hours × rate per line, adds the fees, then tax on the subtotal', () => {
		const priced = priceCharges([{ item: 'occupied-time', time_s: 37200 }], rates(), {
			fees: true
		});
		const time = cents(new Decimal(37200).div(3600).mul('780.00')); // 10 h 20 min
		const subtotal = time.plus('1200.00').plus('600.00');
		const tax = cents(subtotal.mul(19).div(100));
		expect(priced.lines.map((l) => l.amount)).toEqual([time.toFixed(2), '1200.00', '600.00']);
		expect(priced.subtotal).toBe(subtotal.toFixed(2));
		expect(priced.tax).toBe(tax.toFixed(2));
		expect(priced.total).toBe(subtotal.plus(tax).toFixed(2));
		// Written out: 8060.00 + 1800.00 = 9860.00; 19 % of it 1873.40; 11733.40 in all.
		expect([priced.subtotal, priced.tax, priced.total]).toEqual(['9860.00', '1873.40', '11733.40']);
	});

	it('rounds each line half-up before summing, so the subtotal is the sum of what is printed', () => {
		// 1 s at 18.00 per hour is 0.005: half-up gives 0.01 (half-even would give 0.00).
		const priced = priceCharges(
			[
				{ item: 'dwell', time_s: 1 },
				{ item: 'settling', time_s: 1 }
			],
			rates({ hourlyRate: '18.00', taxRate_percent: '0' }),
			{ fees: false }
		);
		expect(priced.lines.map((l) => l.amount)).toEqual(['0.01', '0.01']);
		// Summed before rounding it would be 0.01; per line it is 0.02.
		expect(priced.subtotal).toBe('0.02');
	});

	it('rounds the tax half-up once, on the subtotal', () => {
		// 0.05 at 10 % is 0.005 → 0.01.
		const priced = priceCharges(
			[{ item: 'occupied-time', time_s: 10 }],
			rates({ hourlyRate: '18.00', taxRate_percent: '10' }),
			{ fees: false }
		);
		expect(priced.subtotal).toBe('0.05');
		expect(priced.tax).toBe('0.01');
		expect(priced.total).toBe('0.06');
	});

	it('tops a small job up to the minimum charge with a line of its own, before tax', () => {
		const priced = priceCharges(
			[{ item: 'occupied-time', time_s: 1800 }],
			rates({ minimumCharge: '2000.00', taxRate_percent: '7.5' }),
			{ fees: false }
		);
		const time = cents(new Decimal(1800).div(3600).mul(780));
		const topUp = new Decimal(2000).minus(time);
		expect(priced.lines.at(-1)).toEqual({
			item: 'minimum-charge-top-up',
			time_s: null,
			unitPrice: null,
			amount: topUp.toFixed(2)
		});
		expect(priced.subtotal).toBe('2000.00');
		expect(priced.tax).toBe(cents(new Decimal(2000).mul('7.5').div(100)).toFixed(2));
	});

	it('leaves fees out when told and zero fees off the page', () => {
		const priced = priceCharges(
			[{ item: 'occupied-time', time_s: 3600 }],
			rates({ tearDownFee: '0' }),
			{
				fees: true
			}
		);
		expect(priced.lines.map((l) => l.item)).toEqual(['occupied-time', 'set-up-fee']);
	});

	it('rounds to the currency’s minor unit from ISO 4217', () => {
		// ISO 4217: the yen has no minor unit, the euro two, the Bahraini dinar three.
		expect([minorDigits('JPY'), minorDigits('EUR'), minorDigits('BHD')]).toEqual([0, 2, 3]);
		const priced = priceCharges(
			[{ item: 'occupied-time', time_s: 5400 }],
			rates({
				hourlyRate: '1001',
				currency: 'JPY',
				taxRate_percent: '10',
				setUpFee: '0',
				tearDownFee: '0'
			}),
			{ fees: true }
		);
		// 1.5 h × 1001 = 1501.5 → 1502; 10 % tax 150.2 → 150.
		expect([priced.subtotal, priced.tax, priced.total]).toEqual(['1502', '150', '1652']);
		expect(toMinorUnits(priced.total, 'JPY')).toBe(1652);
		expect(toMinorUnits('11733.40', 'EUR')).toBe(1173340);
	});

	it('negates every line and sum for a credit note', () => {
		const invoice = priceCharges([{ item: 'occupied-time', time_s: 7200 }], rates(), {
			fees: true
		});
		const credit = creditCharges(invoice);
		expect(credit.total).toBe(new Decimal(invoice.total).neg().toFixed(2));
		expect(
			credit.lines.map((l) =>
				new Decimal(l.amount).plus(invoice.lines[credit.lines.indexOf(l)]!.amount).isZero()
			)
		).toEqual(invoice.lines.map(() => true));
	});

	it.each([
		['hourlyRate', '-1'],
		['taxRate_percent', 'x'],
		['minimumCharge', 'NaN']
	] as const)('refuses %s = %s', (field, value) => {
		expect(() =>
			priceCharges([{ item: 'occupied-time', time_s: 60 }], rates({ [field]: value }), {
				fees: true
			})
		).toThrow(CalcInputError);
	});
});

describe('occupancy cost', () => {
	it('is hours × rate to the cent, in decimal arithmetic', () => {
		// decimal.js as the reference: 10 h 20 min at 780.00 per hour.
		expect(occupancyCost(37200, '780.00', 'EUR')).toBe(
			new Decimal(37200).div(3600).mul('780.00').toFixed(2)
		);
		expect(occupancyCost(37200, '780.00', 'EUR')).toBe('8060.00');
		// 0.1 + 0.2 in binary floating point is 0.30000000000000004; in decimals it is exact.
		expect(occupancyCost(3600, '0.1', 'EUR')).toBe('0.10');
		expect(occupancyCost(1, '3600.005', 'EUR')).toBe('1.00');
		// ISO 4217: the yen has no minor unit, so 90 min at 1001 per hour is 1501.5 → 1502.
		expect(occupancyCost(5400, '1001', 'JPY')).toBe('1502');
	});

	it.each(['abc', '-5', 'Infinity'])('refuses the rate %s', (rate) => {
		expect(() => occupancyCost(3600, rate, 'EUR')).toThrow(CalcInputError);
	});
});
