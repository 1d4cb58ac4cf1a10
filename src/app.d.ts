import type { Db } from '$lib/server/db';
import type { SessionUser } from '$lib/roles';

declare global {
	namespace App {
		interface Error {
			message: string;
			code?: string;
			fields?: Record<string, string[]>;
		}
		interface Locals {
			db: Db;
			user: SessionUser | null;
		}
	}
}

export {};
