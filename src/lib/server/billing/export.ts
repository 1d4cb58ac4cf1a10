import { stringify } from 'csv-stringify/sync';
import type { SessionUser } from '../../roles';
import { utcDay } from '../../format';
import { spreadsheetText } from '../csv-download';
import type { Db } from '../db/open';
import { listInvoices, type InvoiceFilter } from './invoices';
import type { InvoiceSummary } from './views';

const HEADER = [
	'number',
	'kind',
	'issued_utc',
	'facility',
	'client_team',
	'campaign',
	'occupied_h',
	'currency',
	'subtotal',
	'tax',
	'total',
	'status',
	'paid_utc',
	'corrects_number'
];

/**
 * Every invoice and credit note of the filtered list the viewer may see, oldest first, as CSV
 * for an accounting tool: amounts as the plain decimal strings they are stored as, dates in UTC,
 * and a credit note naming the number of the invoice it cancels.
 */
export function invoicesCsv(
	db: Db,
	viewer: SessionUser,
	filter: Omit<InvoiceFilter, 'after'>
): string {
	// The list's own pages, so the export sees exactly what the list shows.
	const rows: InvoiceSummary[] = [];
	for (let after: string | undefined; ;) {
		const page = listInvoices(db, viewer, { ...filter, after });
		// Invoices are never deleted, so a row the list named stays a place to go on from.
		if (!page.ok) throw new Error(page.message);
		rows.push(...page.invoices);
		if (!page.next) break;
		after = page.next;
	}
	const numberOf = new Map(rows.map((r) => [r.id, r.printedNumber]));
	const lines = rows
		.reverse()
		.map((r) => [
			r.printedNumber,
			r.kind,
			utcDay(r.issuedAt),
			spreadsheetText(r.facilityName),
			spreadsheetText(r.teamName),
			spreadsheetText(r.campaignName),
			(r.occupied_s / 3600).toFixed(2),
			r.currency,
			r.subtotal,
			r.tax,
			r.total,
			r.status,
			r.paidAt ? utcDay(r.paidAt) : '',
			r.creditsInvoiceId ? (numberOf.get(r.creditsInvoiceId) ?? '') : ''
		]);
	return stringify([HEADER, ...lines]);
}
