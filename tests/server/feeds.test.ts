import { DateTime } from 'luxon';
import { describe, expect, it } from 'vitest';
import { createBooking } from '../../src/lib/server/bookings';
import { mailOutbox } from '../../src/lib/server/db/schema';
import { feedCalendar, feedOwner, rotateFeedToken } from '../../src/lib/server/feeds';
import { approvedCampaignWorld } from './campaign-fixtures';
import { tempDb } from './temp-db';

const ORIGIN = 'http://tunnelwright.test';

describe('calendar feeds (RFC 5545)', () => {
	it('lists the slots the feed’s owner may see, and stops working once rotated', () => {
		const db = tempDb();
		const w = approvedCampaignWorld(db, ORIGIN);
		const created = { id: w.campaignId };
		const operator = w.operator;
		const start = DateTime.now()
			.setZone('Europe/Berlin')
			.plus({ weeks: 2 })
			.startOf('week')
			.plus({ hours: 9 });
		const booked = createBooking(
			db,
			operator,
			w.tunnel,
			{
				campaignId: created.id,
				start: start.toJSDate(),
				end: start.plus({ hours: 2 }).toJSDate(),
				note: ''
			},
			ORIGIN
		);
		expect(booked.ok).toBe(true);
		expect(
			db
				.select()
				.from(mailOutbox)
				.all()
				.map((m) => m.kind)
		).toContain('booking');

		const ics = feedCalendar(db, w.aeroA, ORIGIN);
		// RFC 5545 §3.4, §3.6.1: a VCALENDAR holding one VEVENT with UTC DTSTART/DTEND.
		expect(ics).toMatch(/^BEGIN:VCALENDAR\r\n/);
		expect(ics.match(/BEGIN:VEVENT/g)).toHaveLength(1);
		expect(ics).toContain(`DTSTART:${start.toUTC().toFormat("yyyyLLdd'T'HHmmss'Z'")}`);
		expect(ics).toContain(`UID:${booked.ok && booked.id}@tunnelwright`);
		expect(feedCalendar(db, w.aeroB, ORIGIN).match(/BEGIN:VEVENT/g)).toBeNull();

		const first = rotateFeedToken(db, w.aeroA.id);
		expect(feedOwner(db, first)?.id).toBe(w.aeroA.id);
		const second = rotateFeedToken(db, w.aeroA.id);
		expect(feedOwner(db, first)).toBeNull();
		expect(feedOwner(db, second)?.id).toBe(w.aeroA.id);
	});
});
