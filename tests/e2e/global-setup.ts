import type { TestProject } from 'vitest/node';
import { startSeededApp } from '../../scripts/app-server';

declare module 'vitest' {
	export interface ProvidedContext {
		baseUrl: string;
		databasePath: string;
	}
}

/** Starts the built app on a free port with a freshly seeded database of its own. */
export default async function setup(project: TestProject) {
	const app = await startSeededApp();
	project.provide('baseUrl', app.baseUrl);
	project.provide('databasePath', app.databasePath);
	return app.stop;
}
