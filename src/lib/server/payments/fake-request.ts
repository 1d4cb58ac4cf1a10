import { z } from 'zod';
import type { NewFakeSession } from './fake-sessions';

/** An error as the payment service's API words it, with the HTTP status it comes with. */
export type ServiceError = {
	status: number;
	error: { type: string; code?: string; message: string; param?: string };
};

export function invalidRequest(message: string, code?: string, param?: string): ServiceError {
	return {
		status: 400,
		error: {
			type: 'invalid_request_error',
			message,
			...(code ? { code } : {}),
			...(param ? { param } : {})
		}
	};
}

const LINE = 'line_items[0]';
const FIELDS = {
	mode: 'mode',
	successUrl: 'success_url',
	cancelUrl: 'cancel_url',
	clientReferenceId: 'client_reference_id',
	currency: `${LINE}[price_data][currency]`,
	unitAmount: `${LINE}[price_data][unit_amount]`,
	name: `${LINE}[price_data][product_data][name]`,
	quantity: `${LINE}[quantity]`
} as const;
const METADATA_KEY = /^metadata\[([^[\]]{1,40})\]$/;

const httpUrl = z.url({ protocol: /^https?$/ }).max(2048);
const wholeNumber = z
	.string()
	.regex(/^\d{1,12}$/)
	.transform(Number);
/**
 * The service takes amounts of up to eight digits in the minor unit (Stripe API reference, the
 * Charge object's `amount`: 99999999 is USD 999,999.99).
 */
const MAX_AMOUNT_MINOR = 99_999_999;

/** The form the SDK sends to create a checkout session, as far as the stand-in takes it. */
const createSessionForm = z.object({
	mode: z.literal('payment'),
	successUrl: httpUrl,
	cancelUrl: httpUrl,
	clientReferenceId: z.string().min(1).max(200).optional(),
	currency: z.string().regex(/^[a-z]{3}$/),
	unitAmount: wholeNumber.refine(
		(n) => n > 0 && n <= MAX_AMOUNT_MINOR,
		`must be 1 to ${MAX_AMOUNT_MINOR} in the minor unit`
	),
	name: z.string().min(1).max(500),
	quantity: wholeNumber.refine((n) => n >= 1 && n <= 999, 'must be 1 to 999')
});

/**
 * Reads the SDK's form-encoded body (nested keys flattened with brackets, as
 * `line_items[0][price_data][unit_amount]`). A key the stand-in does not know is refused, as
 * the service refuses unknown parameters, rather than silently dropped.
 */
export function parseCreateSession(body: string): NewFakeSession | ServiceError {
	const form = new URLSearchParams(body);
	const known = new Set<string>(Object.values(FIELDS));
	const metadata: Record<string, string> = {};
	for (const [key, value] of form) {
		const metadataKey = METADATA_KEY.exec(key)?.[1];
		if (metadataKey !== undefined) {
			if (value.length > 500)
				return invalidRequest(
					`Metadata values are at most 500 characters.`,
					'parameter_invalid_string_too_long',
					key
				);
			metadata[metadataKey] = value;
		} else if (!known.has(key)) {
			return invalidRequest(
				`Received unknown parameter: ${key.slice(0, 200)}`,
				'parameter_unknown',
				key.slice(0, 200)
			);
		}
	}
	if (Object.keys(metadata).length > 50)
		return invalidRequest('At most 50 metadata keys.', 'parameter_invalid', 'metadata');
	const raw = Object.fromEntries(
		Object.entries(FIELDS).map(([name, key]) => [name, form.get(key) ?? undefined])
	);
	const parsed = createSessionForm.safeParse(raw);
	if (!parsed.success) {
		const issue = parsed.error.issues[0]!;
		const param = FIELDS[issue.path[0] as keyof typeof FIELDS];
		const missing = raw[issue.path[0] as string] === undefined;
		return invalidRequest(
			missing ? `Missing required param: ${param}.` : `Invalid ${param}: ${issue.message}`,
			missing ? 'parameter_missing' : 'parameter_invalid',
			param
		);
	}
	const { unitAmount, quantity, name, clientReferenceId, successUrl, cancelUrl, currency } =
		parsed.data;
	return {
		amount_minor: unitAmount * quantity,
		currency,
		description: name,
		metadata,
		clientReferenceId: clientReferenceId ?? null,
		successUrl,
		cancelUrl
	};
}
