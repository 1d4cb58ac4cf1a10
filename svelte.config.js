import adapter from '@sveltejs/adapter-node';
import { vitePreprocess } from '@sveltejs/vite-plugin-svelte';

/** @type {import('@sveltejs/kit').Config} */
const config = {
	preprocess: vitePreprocess(),
	compilerOptions: { runes: true },
	kit: {
		adapter: adapter(),
		// Auth.js leaves CSRF to SvelteKit's origin check; keep it on.
		csrf: { trustedOrigins: [] },
		// Scripts run only with SvelteKit's per-response nonce (hashes on prerendered pages). Styles
		// may be inline: Svelte writes style attributes for positions and colours of the pictures.
		csp: {
			mode: 'auto',
			directives: {
				'default-src': ['self'],
				'script-src': ['self'],
				'style-src': ['self', 'unsafe-inline'],
				'img-src': ['self', 'data:', 'blob:'],
				'font-src': ['self'],
				'connect-src': ['self'],
				'object-src': ['none'],
				'base-uri': ['self'],
				// Paying an invoice posts a form that redirects to the payment service's hosted page.
				'form-action': ['self', 'https://checkout.stripe.com'],
				'frame-ancestors': ['none']
			}
		}
	}
};

export default config;
