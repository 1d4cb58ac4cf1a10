import { and, asc, desc, eq } from 'drizzle-orm';
import type { SessionUser } from '../roles';
import { ATTACHMENT_MAX_BYTES, scaleModelSchema, type ScaleModelInput } from '../schemas/model';
import { canReadModel, canWriteModel, modelReadScope, readableModels } from './access';
import { writeTransaction, type Db, type DbOrTx } from './db/open';
import { preparedPerDatabase } from './db/prepared';
import { modelAttachment, scaleModel, team } from './db/schema';
import { refuse, type Outcome } from './outcome';
import { sniffAttachmentType } from './sniff';
import type { ObjectStore } from './storage/object-store';
import { claimVersion, editableValues, type BaseVersion, type StaleRefusal } from './versions';

export type ScaleModel = typeof scaleModel.$inferSelect & { teamName: string };
export type ModelAttachment = typeof modelAttachment.$inferSelect;

const withTeam = (db: DbOrTx) =>
	db
		.select({ model: scaleModel, teamName: team.name })
		.from(scaleModel)
		.innerJoin(team, eq(team.id, scaleModel.teamId));

const flatten = ({
	model,
	teamName
}: {
	model: typeof scaleModel.$inferSelect;
	teamName: string;
}) => ({
	...model,
	teamName
});

/** Models visible to the user: their own teams' only (admins: all), since clients' work is confidential. */
const modelListing = preparedPerDatabase((db) =>
	withTeam(db).where(readableModels).orderBy(asc(team.name), asc(scaleModel.name)).prepare()
);

export function listModelsFor(db: Db, viewer: SessionUser): ScaleModel[] {
	return modelListing(db).all(modelReadScope(viewer)).map(flatten);
}

/** The model if the viewer may see it; otherwise undefined, so callers answer 404 alike. */
export function getModelFor(db: DbOrTx, viewer: SessionUser, id: string): ScaleModel | undefined {
	const row = withTeam(db).where(eq(scaleModel.id, id)).get();
	return row && canReadModel(viewer, row.model) ? flatten(row) : undefined;
}

function nameTaken(db: DbOrTx, teamId: string, name: string, exceptId?: string) {
	const other = db
		.select({ id: scaleModel.id })
		.from(scaleModel)
		.where(and(eq(scaleModel.teamId, teamId), eq(scaleModel.name, name)))
		.get();
	return !!other && other.id !== exceptId;
}

export function createModel(
	db: Db,
	viewer: SessionUser,
	input: ScaleModelInput
): Outcome<{ id: string }> {
	if (!canWriteModel(viewer, { teamId: input.teamId })) {
		return refuse('forbidden', 'You can add models only to your own team.', 'teamId');
	}
	return writeTransaction(db, (tx) => {
		if (nameTaken(tx, input.teamId, input.name)) {
			return refuse('conflict', 'Your team already has a model of this name.', 'name');
		}
		const { id } = tx
			.insert(scaleModel)
			.values({ ...input, createdBy: viewer.id, updatedBy: viewer.id })
			.returning({ id: scaleModel.id })
			.get();
		return { ok: true, id };
	});
}

/** The model if the viewer may change it; not found alike for none and not theirs. */
export function writableModel(
	db: DbOrTx,
	viewer: SessionUser,
	id: string
): Outcome<{ model: ScaleModel }> {
	const model = getModelFor(db, viewer, id);
	if (!model || !canWriteModel(viewer, model)) return refuse('not-found', 'No such model.');
	return { ok: true, model };
}

/** Writes the model if `base` is still its stored version (see `updateCampaign`). */
export function updateModel(
	db: Db,
	viewer: SessionUser,
	id: string,
	input: ScaleModelInput,
	base: BaseVersion
): Outcome<{ version: number }> | StaleRefusal {
	return writeTransaction(db, (tx) => {
		const writable = writableModel(tx, viewer, id);
		if (!writable.ok) return writable;
		const existing = writable.model;
		if (input.teamId !== existing.teamId && !canWriteModel(viewer, { teamId: input.teamId })) {
			return refuse('forbidden', 'You can move a model only to your own team.', 'teamId');
		}
		if (nameTaken(tx, input.teamId, input.name, id)) {
			return refuse('conflict', 'Your team already has a model of this name.', 'name');
		}
		const values = editableValues(scaleModelSchema, existing);
		const claimed = claimVersion(tx, 'scale-model', existing, values, base, { by: viewer.id });
		if (!claimed.ok) return claimed;
		tx.update(scaleModel)
			.set({ ...input, ...claimed.stamp })
			.where(eq(scaleModel.id, id))
			.run();
		return { ok: true, version: claimed.stamp.version };
	});
}

export function listAttachments(db: Db, modelId: string): ModelAttachment[] {
	return db
		.select()
		.from(modelAttachment)
		.where(eq(modelAttachment.modelId, modelId))
		.orderBy(desc(modelAttachment.createdAt))
		.all();
}

/** Stores an upload after checking its size and sniffing its type from the bytes. */
export async function addAttachment(
	db: Db,
	store: ObjectStore,
	viewer: SessionUser,
	modelId: string,
	file: { name: string; bytes: Uint8Array }
): Promise<Outcome<{ id: string }>> {
	const writable = writableModel(db, viewer, modelId);
	if (!writable.ok) return writable;
	if (file.bytes.byteLength === 0) return refuse('invalid', 'The file is empty.', 'file');
	if (file.bytes.byteLength > ATTACHMENT_MAX_BYTES) {
		return refuse(
			'invalid',
			`Files may be at most ${ATTACHMENT_MAX_BYTES / 1024 / 1024} MiB.`,
			'file'
		);
	}
	const mediaType = await sniffAttachmentType(file.bytes);
	if (!mediaType) return refuse('invalid', 'Attach a PDF, PNG, JPEG or SVG file.', 'file');
	const { storageKey, sha256 } = await store.put(file.bytes);
	try {
		const { id } = db
			.insert(modelAttachment)
			.values({
				modelId,
				fileName: file.name.slice(0, 200) || 'attachment',
				mediaType,
				size_bytes: file.bytes.byteLength,
				storageKey,
				sha256,
				uploadedBy: viewer.id
			})
			.returning({ id: modelAttachment.id })
			.get();
		return { ok: true, id };
	} catch (error) {
		await store.remove(storageKey);
		throw error;
	}
}

export function getAttachmentFor(db: Db, viewer: SessionUser, attachmentId: string) {
	const row = db.select().from(modelAttachment).where(eq(modelAttachment.id, attachmentId)).get();
	if (!row) return undefined;
	return getModelFor(db, viewer, row.modelId) ? row : undefined;
}
