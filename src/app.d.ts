import type { Db } from '$lib/server/db';
import type { ObjectStore } from '$lib/server/storage';
import type { SessionUser } from '$lib/roles';
import type { ApiTokenScope } from '$lib/schemas/api-token';

declare global {
	namespace App {
		interface Error {
			message: string;
			code?: string;
			fields?: Record<string, string[]>;
		}
		interface Locals {
			db: Db;
			/** Model attachments and original readings files. */
			files: ObjectStore;
			user: SessionUser | null;
			/** The personal API token this request was signed in with; null for a session. */
			apiToken: { id: string; scopes: ApiTokenScope[] } | null;
			/** Set when the database stayed busy past its timeout; the answer becomes 503. */
			databaseBusy?: boolean;
		}
	}
}

export {};
