import { json } from '@sveltejs/kit';
import { apiError, MAX_REQUEST_BODY_BYTES, readBody, tooLarge } from '$lib/server/api';
import { paymentService, receiveWebhook } from '$lib/server/payments';
import type { RequestHandler } from './$types';

/**
 * The payment service's calls. No session: the signature over the raw body is the credential,
 * so the body is read as bytes and checked before anything in it is used. The hooks let the
 * call through untouched (an API path, no cookie, no bearer token), and a browser's
 * cookie-signed post from another site is still refused by them.
 */
export const POST: RequestHandler = async ({ locals, request, url }) => {
	const body = await readBody(request, MAX_REQUEST_BODY_BYTES);
	if (body === null) return tooLarge();
	const answer = receiveWebhook(
		locals.db,
		paymentService(),
		body,
		request.headers.get('stripe-signature'),
		url.origin
	);
	if (!answer.ok) return apiError(400, answer.code, answer.message);
	return json({ received: true, outcome: answer.receipt });
};
