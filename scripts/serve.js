// The production start (`npm start`): adapter-node's server from build/, with the product's body
// limit unless the deployment sets its own, and the security headers on every response. The
// headers are set before adapter-node's handler runs, so static files get them too; a page's own
// headers (SvelteKit's CSP among them) replace these where both name one.
import { DEFAULT_BODY_SIZE_LIMIT, securityHeaders } from './serve-config.js';

process.env.BODY_SIZE_LIMIT ??= DEFAULT_BODY_SIZE_LIMIT;

const { server } = await import('../build/index.js');
const headers = securityHeaders(process.env.ORIGIN);
server.server.prependListener(
	'request',
	/** @param {import('node:http').IncomingMessage} _request @param {import('node:http').ServerResponse} response */
	(_request, response) => {
		for (const [name, value] of headers) response.setHeader(name, value);
	}
);
