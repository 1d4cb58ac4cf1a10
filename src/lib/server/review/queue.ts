import { and, asc, eq } from 'drizzle-orm';
import type { SessionUser } from '../../roles';
import { can } from '../access';
import type { Db } from '../db/open';
import { campaign, campaignRevision, facility, team, user } from '../db/schema';

/** Campaigns waiting for a decision, oldest submission first. */
export function reviewQueue(db: Db, viewer: SessionUser) {
	if (!can(viewer, 'read-review-queue')) return [];
	return db
		.select({
			id: campaign.id,
			name: campaign.name,
			revision: campaign.lastRevision,
			ownerId: campaign.ownerId,
			ownerName: user.name,
			teamName: team.name,
			facilityName: facility.name,
			submittedAt: campaignRevision.submittedAt,
			snapshot: campaignRevision.snapshot
		})
		.from(campaign)
		.innerJoin(
			campaignRevision,
			and(
				eq(campaignRevision.campaignId, campaign.id),
				eq(campaignRevision.number, campaign.lastRevision)
			)
		)
		.innerJoin(user, eq(user.id, campaign.ownerId))
		.innerJoin(team, eq(team.id, campaign.teamId))
		.innerJoin(facility, eq(facility.id, campaign.facilityId))
		.where(eq(campaign.state, 'in-review'))
		.orderBy(asc(campaignRevision.submittedAt))
		.all()
		.map(({ snapshot, ...q }) => ({
			...q,
			points: snapshot.figures.occupancy.counts.points,
			limits: snapshot.figures.findings.filter((f) => f.level === 'limit').length,
			cautions: snapshot.figures.findings.filter((f) => f.level === 'caution').length,
			ownedByViewer: q.ownerId === viewer.id
		}));
}
