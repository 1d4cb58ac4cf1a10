import { asc, eq, inArray } from 'drizzle-orm';
import type { SessionUser } from '../roles';
import type { Db } from './db/open';
import { scaleModel, team } from './db/schema';

export type ScaleModel = typeof scaleModel.$inferSelect & { teamName: string };

/** Models visible to the user: their own teams' only, since clients' work is confidential. */
export function listModelsFor(db: Db, viewer: SessionUser): ScaleModel[] {
	const teamIds = viewer.teams.map((t) => t.id);
	if (!teamIds.length) return [];
	return db
		.select({ model: scaleModel, teamName: team.name })
		.from(scaleModel)
		.innerJoin(team, eq(team.id, scaleModel.teamId))
		.where(inArray(scaleModel.teamId, teamIds))
		.orderBy(asc(team.name), asc(scaleModel.name))
		.all()
		.map(({ model, teamName }) => ({ ...model, teamName }));
}
