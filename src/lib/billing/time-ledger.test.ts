import { describe, expect, it } from 'vitest';
import type { BookingState } from '../booking/rules';
import { timeLedger } from './time-ledger';

// Slot spans and their sums are worked out by hand in each test from the clock times below.
const H = 3600;
const slot = (state: BookingState, day: number, from: string, to: string) => ({
	state,
	start: new Date(`2027-01-0${day}T${from}:00Z`),
	end: new Date(`2027-01-0${day}T${to}:00Z`)
});
const SLOTS = [
	slot('completed', 4, '08:00', '12:00'), // 4 h
	slot('completed', 5, '13:00', '15:30'), // 2.5 h
	slot('confirmed', 6, '08:00', '11:00'), // 3 h
	slot('cancelled', 7, '08:00', '10:00') // 2 h, held no tunnel
];
// The first 4 h slot invoiced, credited, and invoiced again.
const DOCUMENTS = [{ occupied_s: 4 * H }, { occupied_s: -4 * H }, { occupied_s: 4 * H }];

describe('timeLedger', () => {
	it('sets quoted, booked, used and billed time side by side', () => {
		const ledger = timeLedger(5 * H, SLOTS, DOCUMENTS);
		expect(ledger).toMatchObject({
			quoted_s: 5 * H,
			booked_s: (4 + 2.5 + 3) * H,
			used_s: (4 + 2.5) * H,
			billed_s: 4 * H,
			toBill_s: 2.5 * H
		});
		// 6.5 h used against 5 h quoted: 1.5 h over, 1.5 / 5 = 30 %.
		expect(ledger.findings.map((f) => [f.level, f.code, f.message])).toEqual([
			['caution', 'used-beyond-quote', 'The completed slots took 1.50 h (30 %) more than quoted.'],
			['info', 'not-yet-invoiced', '2.50 h of completed slots not yet invoiced.']
		]);
	});

	it('notes booked time beyond the quote while the used time is within it', () => {
		// 9.5 h booked against 8 h quoted: 1.5 h over, 1.5 / 8 = 18.75 %, shown as 19 %.
		const ledger = timeLedger(8 * H, SLOTS, [...DOCUMENTS, { occupied_s: 2.5 * H }]);
		expect(ledger.toBill_s).toBe(0);
		expect(ledger.findings.map((f) => [f.code, f.message])).toEqual([
			['booked-beyond-quote', 'The slots booked hold 1.50 h (19 %) more than quoted.']
		]);
		expect(timeLedger(10 * H, SLOTS, DOCUMENTS).findings.map((f) => f.code)).toEqual([
			'not-yet-invoiced'
		]);
	});

	it('says when there is no accepted quote, and nothing for a campaign with no slots', () => {
		expect(timeLedger(null, SLOTS, []).findings.map((f) => f.code)).toEqual([
			'no-accepted-quote',
			'not-yet-invoiced'
		]);
		expect(timeLedger(null, [], [])).toEqual({
			quoted_s: null,
			booked_s: 0,
			used_s: 0,
			billed_s: 0,
			toBill_s: 0,
			findings: []
		});
	});
});
