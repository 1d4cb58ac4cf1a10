import { sveltekit } from '@sveltejs/kit/vite';
import tailwindcss from '@tailwindcss/vite';
import { defineConfig } from 'vitest/config';

export default defineConfig({
	plugins: [tailwindcss(), sveltekit()],
	// convert-units' lodash helpers read Node's `global`; the browser calls it globalThis.
	define: { global: 'globalThis' },
	test: {
		expect: { requireAssertions: true },
		projects: [
			{
				extends: true,
				test: {
					name: 'unit',
					environment: 'node',
					include: ['src/**/*.test.ts', 'tests/unit/**/*.test.ts', 'tests/server/**/*.test.ts'],
					exclude: ['src/**/*.svelte.test.ts']
				}
			},
			{
				// Components with logic, rendered in jsdom. Svelte's browser build is the one that mounts.
				extends: true,
				resolve: { conditions: ['browser'] },
				test: {
					name: 'component',
					environment: 'jsdom',
					include: ['src/**/*.svelte.test.ts'],
					// Unmounts each test's components afterwards (no vitest globals here to hook into).
					setupFiles: ['@testing-library/svelte/vitest']
				}
			},
			{
				extends: true,
				test: {
					name: 'e2e',
					environment: 'node',
					include: ['tests/e2e/**/*.e2e.ts'],
					globalSetup: ['tests/e2e/global-setup.ts'],
					testTimeout: 60_000,
					hookTimeout: 180_000,
					fileParallelism: false
				}
			}
		]
	}
});
