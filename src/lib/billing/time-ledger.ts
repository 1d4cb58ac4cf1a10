import type { Finding } from '../calc';
import { finding } from '../calc/findings';
import type { BookingState } from '../booking/rules';
import { billedHours, percent } from '../format';

/** A slot of the campaign as the ledger counts it: its state and its span on the calendar. */
export type LedgerSlot = { state: BookingState; start: Date; end: Date };

/**
 * A campaign's tunnel time four ways, so the client and the facility can see whether they agree:
 * what the accepted quote estimated, what is booked, what the completed slots took, and what
 * the invoices bill net of credit notes.
 */
export type TimeLedger = {
	/** The accepted quote's estimated occupancy; null while no quote is accepted. */
	quoted_s: number | null;
	/** Slots that hold or held the tunnel: pencilled, confirmed and completed. */
	booked_s: number;
	/** The completed slots. */
	used_s: number;
	/** On invoices, less what credit notes took back. */
	billed_s: number;
	/** Completed and on no standing invoice. */
	toBill_s: number;
	findings: Finding[];
};

const span_s = (slot: LedgerSlot) => (slot.end.getTime() - slot.start.getTime()) / 1000;
const total = (values: number[]) => values.reduce((sum, v) => sum + v, 0);
// Slot times are whole milliseconds, so sums of them agree to far better than a second.
const SAME_S = 0.5;

/**
 * Sets the campaign's quoted, booked, used and billed time side by side. `documents` are the
 * occupied seconds of its invoices and credit notes; a credit note carries its invoice's time
 * with the sign turned, so their sum is the time that stands billed.
 */
export function timeLedger(
	quoted_s: number | null,
	slots: LedgerSlot[],
	documents: { occupied_s: number }[]
): TimeLedger {
	const booked_s = total(slots.filter((s) => s.state !== 'cancelled').map(span_s));
	const used_s = total(slots.filter((s) => s.state === 'completed').map(span_s));
	const billed_s = total(documents.map((d) => d.occupied_s));
	const toBill_s = used_s - billed_s > SAME_S ? used_s - billed_s : 0;
	const findings: Finding[] = [];
	const beyond = (time_s: number) =>
		`${billedHours(time_s - quoted_s!)} (${percent((time_s - quoted_s!) / quoted_s!, 0)})`;
	if (quoted_s === null) {
		if (booked_s > 0)
			findings.push(
				finding('info', 'no-accepted-quote', 'No accepted quote to set the time against.')
			);
	} else if (used_s - quoted_s > SAME_S) {
		findings.push(
			finding(
				'caution',
				'used-beyond-quote',
				`The completed slots took ${beyond(used_s)} more than quoted.`
			)
		);
	} else if (booked_s - quoted_s > SAME_S) {
		findings.push(
			finding(
				'info',
				'booked-beyond-quote',
				`The slots booked hold ${beyond(booked_s)} more than quoted.`
			)
		);
	}
	if (toBill_s > 0)
		findings.push(
			finding(
				'info',
				'not-yet-invoiced',
				`${billedHours(toBill_s)} of completed slots not yet invoiced.`
			)
		);
	return { quoted_s, booked_s, used_s, billed_s, toBill_s, findings };
}
