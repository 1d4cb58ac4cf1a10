/** Records people edit, each carrying a version that every write must name (see server/versions). */
export const VERSIONED_KINDS = ['campaign', 'scale-model', 'facility', 'booking'] as const;
export type VersionedKind = (typeof VERSIONED_KINDS)[number];

/** One field that differs between the version a writer read and the stored one. */
export type FieldChange = { field: string; label: string; before: string; after: string };

/** What a writer whose version went stale is told: who changed what since they read it. */
export type StaleDetail = {
	/** The stored version now; naming it in a new write keeps the writer's values deliberately. */
	version: number;
	changedBy: string[];
	changedAt: string;
	changes: FieldChange[];
};

/** The stale detail in one sentence, for places that show a message rather than a table. */
export function staleSentence(stale: StaleDetail): string {
	const who = stale.changedBy.join(', ') || 'someone else';
	const at = `${stale.changedAt.slice(0, 16).replace('T', ' ')} UTC`;
	const what = stale.changes.map((c) => `${c.label.toLowerCase()} ${c.before} → ${c.after}`);
	return `${who} saved this at ${at}, after you opened it${what.length ? `: ${what.join('; ')}` : ''}. Reload to see it, then make your change again.`;
}
