import { createHash, randomBytes } from 'node:crypto';
import { and, asc, eq, gt, inArray } from 'drizzle-orm';
import ical from 'ical-generator';
import { ACTIVE_BOOKING_STATES } from '../booking/rules';
import type { SessionUser } from '../roles';
import type { Db } from './db/open';
import { booking, calendarFeed, campaign, facility, user } from './db/schema';
import { sessionUser } from './users';

const hashOf = (token: string) => createHash('sha256').update(token).digest('hex');

/** A new secret feed address for the user; the old one stops working at once. */
export function rotateFeedToken(db: Db, userId: string): string {
	const token = randomBytes(24).toString('base64url');
	db.insert(calendarFeed)
		.values({ userId, tokenHash: hashOf(token) })
		.onConflictDoUpdate({
			target: calendarFeed.userId,
			set: { tokenHash: hashOf(token), createdAt: new Date() }
		})
		.run();
	return token;
}

export function hasFeed(db: Db, userId: string): boolean {
	return !!db
		.select({ userId: calendarFeed.userId })
		.from(calendarFeed)
		.where(eq(calendarFeed.userId, userId))
		.get();
}

/** The account a feed address belongs to, with its current roles and teams. */
export function feedOwner(db: Db, token: string): SessionUser | null {
	const row = db
		.select({ id: user.id, sessionVersion: user.sessionVersion })
		.from(calendarFeed)
		.innerJoin(user, eq(user.id, calendarFeed.userId))
		.where(eq(calendarFeed.tokenHash, hashOf(token)))
		.get();
	return row ? sessionUser(db, row.id, row.sessionVersion) : null;
}

/**
 * The user's tunnel slots as iCalendar (RFC 5545): every active slot for facility staff, their
 * teams' slots for aerodynamicists; optionally one facility only. From a week ago on.
 */
export function feedCalendar(
	db: Db,
	viewer: SessionUser,
	origin: string,
	facilityId?: string
): string {
	const staff = viewer.roles.some((r) => r === 'operator' || r === 'reviewer' || r === 'admin');
	const teamIds = viewer.teams.map((t) => t.id);
	const rows = db
		.select({
			b: booking,
			campaignName: campaign.name,
			facilityName: facility.name,
			teamId: campaign.teamId
		})
		.from(booking)
		.innerJoin(campaign, eq(campaign.id, booking.campaignId))
		.innerJoin(facility, eq(facility.id, booking.facilityId))
		.where(
			and(
				inArray(booking.state, [...ACTIVE_BOOKING_STATES]),
				gt(booking.end, new Date(Date.now() - 7 * 86_400_000)),
				facilityId ? eq(booking.facilityId, facilityId) : undefined,
				staff ? undefined : inArray(campaign.teamId, teamIds.length ? teamIds : [''])
			)
		)
		.orderBy(asc(booking.start))
		.all();
	const calendar = ical({
		name: facilityId
			? `Tunnelwright: ${rows[0]?.facilityName ?? 'facility'}`
			: 'Tunnelwright: tunnel slots',
		prodId: { company: 'Tunnelwright', product: 'tunnel-slots' }
	});
	for (const { b, campaignName, facilityName } of rows) {
		calendar.createEvent({
			id: `${b.id}@tunnelwright`,
			start: b.start,
			end: b.end,
			summary: `${facilityName}: ${campaignName}${b.state === 'pencilled' ? ' (pencilled)' : ''}`,
			description: b.note || undefined,
			url: `${origin}/campaigns/${b.campaignId}`,
			stamp: b.updatedAt
		});
	}
	return calendar.toString();
}
