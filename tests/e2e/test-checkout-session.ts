import Database from 'better-sqlite3';
import { randomBytes } from 'node:crypto';

/**
 * A session of the local payment stand-in that names no invoice, written straight into the
 * app's database, so the access checks and the fuzz can pay it without marking anything paid.
 */
export function addTestCheckoutSession(databasePath: string, baseUrl: string): string {
	const id = `cs_test_${randomBytes(24).toString('hex')}`;
	const db = new Database(databasePath, { fileMustExist: true });
	try {
		db.prepare(
			`insert into fake_checkout_session
				(id, amount_minor, currency, description, metadata, success_url, cancel_url)
				values (?, ?, ?, ?, ?, ?, ?)`
		).run(id, 100, 'eur', 'Checkout of the access checks', '{}', `${baseUrl}/`, `${baseUrl}/`);
	} finally {
		db.close();
	}
	return id;
}
