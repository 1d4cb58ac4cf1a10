import type { Config } from 'tailwindcss';

// Colours are CSS variables set in app.css, so one set of class names serves light and dark.
const token = (name: string) => `var(--tw-${name})`;

export default {
	content: ['./src/**/*.{html,svelte,ts}'],
	theme: {
		extend: {
			colors: {
				canvas: token('canvas'),
				panel: token('panel'),
				sunken: token('sunken'),
				rule: token('rule'),
				ink: { DEFAULT: token('ink'), soft: token('ink-soft'), faint: token('ink-faint') },
				accent: {
					DEFAULT: token('accent'),
					strong: token('accent-strong'),
					wash: token('accent-wash')
				},
				caution: { DEFAULT: token('caution'), wash: token('caution-wash') },
				limit: { DEFAULT: token('limit'), wash: token('limit-wash') },
				good: { DEFAULT: token('good'), wash: token('good-wash') }
			},
			fontFamily: {
				sans: ['"IBM Plex Sans"', 'system-ui', 'sans-serif'],
				mono: ['"IBM Plex Mono"', 'ui-monospace', 'monospace']
			},
			fontSize: { xxs: ['0.6875rem', { lineHeight: '1rem' }] },
			borderRadius: { card: '0.375rem' }
		}
	}
} satisfies Config;
