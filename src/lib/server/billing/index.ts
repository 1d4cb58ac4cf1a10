/**
 * Money for tunnel time: quotes priced from an approved revision's estimate, invoices and credit
 * notes from completed slots, in one numbered sequence per facility. Payment is in
 * `server/payments`.
 */
export {
	acceptedQuoteFor,
	campaignQuotes,
	decideQuote,
	getQuote,
	issueQuote,
	type Quote
} from './quotes';
export {
	creditInvoice,
	getInvoice,
	INVOICE_PAGE_SIZE,
	issueInvoice,
	listInvoices,
	slotsToInvoice,
	type Invoice
} from './invoices';
export { invoiceView, quoteResource, type InvoiceSummary, type InvoiceView } from './views';
export { campaignBilling } from './campaign-billing';
export { invoicesCsv } from './export';
