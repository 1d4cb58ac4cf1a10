// What the production start sets around adapter-node's server. Plain JavaScript: `npm start`
// runs it with Node alone, next to the build.

/**
 * Largest request body the server reads, as adapter-node parses it (K, M, G are powers of 1024).
 * It must hold the largest upload the product accepts (a 24 MiB readings file and its envelope);
 * each route's own, smaller limit is checked in the hooks before any body is read, with the
 * structured error.
 */
export const DEFAULT_BODY_SIZE_LIMIT = '25M';

/**
 * Headers every response carries, static files and errors included. The page's
 * Content-Security-Policy comes from SvelteKit (`kit.csp`, with nonces); this one is for what is
 * not a page: it lets nothing run or load.
 * @param {string | undefined} origin the public origin (`ORIGIN`)
 * @returns {[string, string][]}
 */
export function securityHeaders(origin) {
	const headers = /** @type {[string, string][]} */ ([
		['x-content-type-options', 'nosniff'],
		['referrer-policy', 'same-origin'],
		['x-frame-options', 'DENY'],
		['cross-origin-opener-policy', 'same-origin'],
		['cross-origin-resource-policy', 'same-origin'],
		[
			'permissions-policy',
			'camera=(), microphone=(), geolocation=(), payment=(), usb=(), interest-cohort=()'
		],
		['content-security-policy', "default-src 'none'; frame-ancestors 'none'; sandbox"]
	]);
	// HSTS is only meaningful, and only safe to promise, when the app is served over https.
	if (origin?.startsWith('https://'))
		headers.push(['strict-transport-security', 'max-age=31536000; includeSubDomains']);
	return headers;
}
