/**
 * Booked tunnel time: slots and their workflow (`slots.ts`), the rules a slot must meet
 * (`conflicts.ts`), closures, the calendar as each viewer may see it, and proposals of free time.
 */
export { listBookings, type CalendarEntry } from './calendar';
export { createClosure, listClosures } from './closures';
export { activeBooking, collidingBooking } from './conflicts';
export { bookableCampaigns, proposeFor } from './proposals';
export { campaignSlots, changeBooking, createBooking, findBookingFor, type Booking } from './slots';
