import { and, eq, gt, inArray } from 'drizzle-orm';
import type { z } from 'zod';
import type { FieldChange, StaleDetail, VersionedKind } from '../versions';
import type { Tx } from './db/open';
import { editHistory, user } from './db/schema';
import type { Refusal } from './outcome';

/**
 * The version a writer read: a number, or `'any'` for a writer who has seen the newer version
 * and keeps their own values deliberately (HTTP's `If-Match: *`).
 */
export type BaseVersion = number | 'any';

/**
 * A version as an HTTP entity tag. It is strong: it changes with every write of the fields PUT
 * takes, which is all If-Match compares.
 */
export function entityTag(version: number): string {
	return `"${version}"`;
}

export type StaleRefusal = Refusal & { code: 'stale'; stale: StaleDetail };

/** A stored record's row as the version check needs it. */
export type VersionedRow = {
	id: string;
	version: number;
	updatedBy: string | null;
	updatedAt: Date;
};

/** What every accepted write of a versioned record sets beside its own fields. */
export type VersionStamp = { version: number; updatedBy: string; updatedAt: Date };

/**
 * Checks the writer's version against the stored one and, when they match, files the stored
 * values in the edit history so a later stale writer can be told what changed, and answers the
 * stamp the write sets. Call it inside the immediate transaction that then writes: the check and
 * the write must not let another process in between.
 */
export function claimVersion(
	tx: Tx,
	kind: VersionedKind,
	stored: VersionedRow,
	values: Record<string, unknown>,
	base: BaseVersion,
	writer: { by: string; at?: Date }
): { ok: true; stamp: VersionStamp } | StaleRefusal {
	if (base !== 'any' && base !== stored.version)
		return {
			ok: false,
			code: 'stale',
			message: 'Someone saved a newer version since you opened this.',
			stale: staleDetail(tx, kind, stored, values, base)
		};
	tx.insert(editHistory)
		.values({
			kind,
			recordId: stored.id,
			version: stored.version,
			values,
			madeBy: stored.updatedBy,
			madeAt: stored.updatedAt
		})
		.onConflictDoNothing()
		.run();
	return {
		ok: true,
		stamp: { version: stored.version + 1, updatedBy: writer.by, updatedAt: writer.at ?? new Date() }
	};
}

/** Drops the edit history of a record that is deleted. */
export function forgetHistory(tx: Tx, kind: VersionedKind, recordId: string) {
	tx.delete(editHistory)
		.where(and(eq(editHistory.kind, kind), eq(editHistory.recordId, recordId)))
		.run();
}

/** Who saved the versions after `base`, and which fields differ from what the writer read. */
function staleDetail(
	tx: Tx,
	kind: VersionedKind,
	stored: VersionedRow,
	values: Record<string, unknown>,
	base: number
): StaleDetail {
	const later = tx
		.select({ version: editHistory.version, values: editHistory.values, by: editHistory.madeBy })
		.from(editHistory)
		.where(
			and(
				eq(editHistory.kind, kind),
				eq(editHistory.recordId, stored.id),
				gt(editHistory.version, base - 1)
			)
		)
		.all();
	const read = later.find((h) => h.version === base);
	const authorIds = [
		...new Set(
			[...later.filter((h) => h.version > base).map((h) => h.by), stored.updatedBy].filter(
				(id): id is string => !!id
			)
		)
	];
	const names = authorIds.length
		? tx
				.select({ id: user.id, name: user.name, email: user.email })
				.from(user)
				.where(inArray(user.id, authorIds))
				.all()
				.map((u) => u.name || u.email)
		: [];
	return {
		version: stored.version,
		changedBy: names,
		changedAt: stored.updatedAt.toISOString(),
		changes: read ? changedFields(read.values, values) : []
	};
}

/** The fields of a stored row that a form or PUT writes, as the schema names them. */
export function editableValues(schema: z.ZodObject, row: object): Record<string, unknown> {
	const fields = row as Record<string, unknown>;
	return Object.fromEntries(Object.keys(schema.shape).map((key) => [key, fields[key]]));
}

/** Top-level fields whose values differ, described for a person to compare. */
export function changedFields(
	before: Record<string, unknown>,
	after: Record<string, unknown>
): FieldChange[] {
	const fields = [...new Set([...Object.keys(before), ...Object.keys(after)])];
	return fields
		.filter((field) => JSON.stringify(before[field]) !== JSON.stringify(after[field]))
		.map((field) => ({
			field,
			label: fieldLabel(field),
			before: describeValue(before[field]),
			after: describeValue(after[field])
		}));
}

const UNIT_WORDS: Record<string, string> = {
	m: 'm',
	mps: 'm/s',
	m2: 'm²',
	m3: 'm³',
	Pa: 'Pa',
	K: 'K',
	deg: '°',
	s: 's'
};

/** `sectionWidth_m` → "section width (m)": the field names already carry the unit. */
export function fieldLabel(field: string): string {
	const [name = field, unit] = field.split('_');
	const words = name
		.replace(/Id$/, '')
		.replace(/([a-z0-9])([A-Z])/g, '$1 $2')
		.toLowerCase();
	const label = words.charAt(0).toUpperCase() + words.slice(1);
	return unit && UNIT_WORDS[unit] ? `${label} (${UNIT_WORDS[unit]})` : label;
}

const MAX_DESCRIPTION = 120;

function describeValue(value: unknown): string {
	const text =
		value === null || value === undefined
			? '—'
			: typeof value === 'object'
				? Array.isArray(value) && value.every((v) => typeof v !== 'object')
					? value.join(', ')
					: JSON.stringify(value)
				: String(value);
	return text.length > MAX_DESCRIPTION ? `${text.slice(0, MAX_DESCRIPTION - 1)}…` : text;
}
