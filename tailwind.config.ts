import type { Config } from 'tailwindcss';

// The theme is in src/app.css (@theme); kept, loaded by @config, to say where class names are found.
export default { content: ['./src/**/*.{html,svelte,ts}'] } satisfies Config;
