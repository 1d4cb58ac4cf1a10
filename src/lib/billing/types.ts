import type { ChargeItem } from '../calc';

export type { FacilityRates, PriceLine, PricedCharges } from '../calc';

/**
 * A quote is issued, then accepted or declined by the client; issuing a newer one for the same
 * campaign supersedes an open one.
 */
export const QUOTE_STATES = ['issued', 'accepted', 'declined', 'superseded'] as const;
export type QuoteState = (typeof QUOTE_STATES)[number];

export const INVOICE_KINDS = ['invoice', 'credit-note'] as const;
export type InvoiceKind = (typeof INVOICE_KINDS)[number];

/** Audit-trail entries of a campaign's money: none of them moves the campaign's own state. */
export const BILLING_ACTIONS = [
	'issue-quote',
	'accept-quote',
	'decline-quote',
	'issue-invoice',
	'issue-credit-note',
	'receive-payment'
] as const;
export type BillingAction = (typeof BILLING_ACTIONS)[number];

export const CHARGE_LABELS: Record<ChargeItem, string> = {
	'set-up-and-tear-down-time': 'Set-up and tear-down time',
	'configuration-changes': 'Configuration changes',
	'yaw-changes': 'Yaw changes',
	settling: 'Flow settling after each speed',
	'traverse-moves': 'Traverse moves between points',
	dwell: 'Readings at the probe points',
	'occupied-time': 'Tunnel time used (completed slots)',
	'set-up-fee': 'Set-up fee',
	'tear-down-fee': 'Tear-down fee',
	'minimum-charge-top-up': 'Top-up to the minimum charge'
};
