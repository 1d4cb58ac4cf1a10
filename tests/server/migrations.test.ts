import { mkdtempSync, readdirSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import Database from 'better-sqlite3';
import { describe, expect, it } from 'vitest';

/** Applies the migrations in drizzle/ up to (not including) the one whose name contains `before`. */
function databaseBefore(before: string) {
	const db = new Database(join(mkdtempSync(join(tmpdir(), 'tunnelwright-migration-')), 'm.db'));
	const files = readdirSync('drizzle')
		.filter((f) => f.endsWith('.sql'))
		.sort();
	const apply = (file: string) =>
		readFileSync(join('drizzle', file), 'utf8')
			.split('--> statement-breakpoint')
			.forEach((statement) => db.exec(statement));
	const at = files.findIndex((f) => f.includes(before));
	files.slice(0, at).forEach(apply);
	return { db, next: () => apply(files[at]!) };
}

describe('the speed-unit migration', () => {
	it('relabels stored mile-per-hour campaigns and revisions as mph', () => {
		const { db, next } = databaseBefore('speed_unit_mph');
		db.exec(`
			insert into user (id, email) values ('u', 'u@example.org');
			insert into team (id, name, kind) values ('t', 'T', 'client');
			insert into facility (id, name, section_kind, section_width_m, section_height_m, section_length_m,
				min_speed_mps, max_speed_mps, max_dynamic_pressure_pa, yaw_min_deg, yaw_max_deg, blockage_caution,
				blockage_limit, settling_s, traverse_move_s, yaw_change_s, model_change_s, set_up_s, tear_down_s,
				opening_hours, time_zone, hourly_rate, currency, site_altitude_m, typical_temperature_k,
				typical_relative_humidity)
				values ('f', 'F', 'closed', 2, 1.5, 5, 5, 50, 1600, -15, 15, 0.05, 0.1, 60, 5, 45, 1800, 3600, 3600,
				'{}', 'UTC', '1.00', 'EUR', 0, 293.15, 0.5);
			insert into scale_model (id, team_id, name, kind, scale_denominator, full_scale_length_m,
				full_scale_width_m, full_scale_height_m, full_scale_frontal_area_m2, reference_length_m)
				values ('m', 't', 'M', 'road-vehicle', 4, 4, 2, 1.5, 2.2, 4);
			insert into campaign (id, team_id, owner_id, model_id, facility_id, name, objective, definition)
				values ('a', 't', 'u', 'm', 'f', 'Miles', '', '{"speedUnit":"m/h"}'),
				       ('b', 't', 'u', 'm', 'f', 'Metric', '', '{"speedUnit":"km/h"}');
			insert into campaign_revision (id, campaign_id, number, snapshot, submitted_by)
				values ('r', 'a', 1, '{"definition":{"speedUnit":"m/h"}}', 'u');
		`);
		next();
		const unit = (id: string) =>
			(
				db
					.prepare("select json_extract(definition, '$.speedUnit') as u from campaign where id = ?")
					.get(id) as { u: string }
			).u;
		expect(unit('a')).toBe('mph');
		expect(unit('b')).toBe('km/h');
		expect(
			(
				db
					.prepare(
						"select json_extract(snapshot, '$.definition.speedUnit') as u from campaign_revision"
					)
					.get() as { u: string }
			).u
		).toBe('mph');
	});
});

describe('the migration that drops the unused Auth.js adapter tables', () => {
	it('keeps every user with the columns the app reads, and drops the provider links', () => {
		const { db, next } = databaseBefore('drop_unused_auth_tables');
		db.exec(`
			insert into user (id, name, email, email_verified, image, password_hash, active, session_version)
				values ('u', 'Ada', 'u@example.org', 1, 'a.png', 'hash', 0, 3);
			insert into account (user_id, type, provider, provider_account_id)
				values ('u', 'oauth', 'somewhere', 'x');
			insert into user_role (user_id, role) values ('u', 'admin');
		`);
		next();
		expect(db.prepare('select * from user').all()).toEqual([
			{
				id: 'u',
				name: 'Ada',
				email: 'u@example.org',
				password_hash: 'hash',
				active: 0,
				session_version: 3,
				created_at: expect.any(Number)
			}
		]);
		expect(db.prepare('select role from user_role').all()).toEqual([{ role: 'admin' }]);
		expect(
			db.prepare("select name from sqlite_master where type = 'table' and name = 'account'").all()
		).toEqual([]);
	});
});

describe('the migration that gives edited records a version', () => {
	it('starts every existing record at version 1, last changed when it was made', () => {
		const { db, next } = databaseBefore('edit_versions');
		db.exec(`
			insert into user (id, email) values ('u', 'u@example.org');
			insert into team (id, name, kind) values ('t', 'T', 'client');
			insert into scale_model (id, team_id, name, kind, scale_denominator, full_scale_length_m,
				full_scale_width_m, full_scale_height_m, full_scale_frontal_area_m2, reference_length_m,
				created_at)
				values ('m', 't', 'M', 'road-vehicle', 4, 4, 2, 1.5, 2.2, 4, 1700000000000);
		`);
		next();
		expect(db.prepare('select version, updated_by, updated_at from scale_model').get()).toEqual({
			version: 1,
			updated_by: null,
			updated_at: 1700000000000
		});
		// A user who is removed leaves the records they changed, unattributed.
		db.exec(`update scale_model set updated_by = 'u'; pragma foreign_keys = on; delete from user;`);
		expect(db.prepare('select updated_by from scale_model').get()).toEqual({ updated_by: null });
	});
});
