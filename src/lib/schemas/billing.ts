import { z } from 'zod';

const recordId = z.string().trim().min(1).max(64);

/** The client's answer to a quote, from the quote page or `POST /api/v1/quotes/:id/acceptance`. */
export const quoteDecisionSchema = z.object({
	decision: z.enum(['accept', 'decline'], { error: 'Answer accept or decline.' }),
	note: z.string().trim().max(2000).default('')
});
export type QuoteDecision = z.infer<typeof quoteDecisionSchema>;

/** An invoice for a campaign's completed slots not yet invoiced. */
export const invoiceRequestSchema = z.object({ campaignId: recordId });

/** A credit note cancels a whole invoice; the reason is printed on it. */
export const creditNoteSchema = z.object({
	reason: z.string().trim().min(1, { error: 'Say what the credit note corrects.' }).max(2000)
});

/** Filters of the invoice list, as query parameters. */
export const invoiceQuerySchema = z.object({
	facility: recordId.optional(),
	team: recordId.optional(),
	campaign: recordId.optional(),
	after: recordId.optional()
});
