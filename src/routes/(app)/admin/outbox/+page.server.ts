import { fail } from '@sveltejs/kit';
import { z } from 'zod';
import { requireRole } from '$lib/server/guards';
import {
	catchingMail,
	deliverNow,
	listCaughtMail,
	listOutbox,
	MAX_ATTEMPTS,
	retryMail
} from '$lib/server/mail';
import { STATUS_OF_REFUSAL } from '$lib/server/outcome';
import type { Actions, PageServerLoad } from './$types';
import { postedForm } from '$lib/server/forms';

const SHOWN_MESSAGES = 200;

export const load: PageServerLoad = ({ locals }) => {
	requireRole(locals, 'admin');
	return {
		messages: listOutbox(locals.db, { limit: SHOWN_MESSAGES }),
		caught: catchingMail() ? listCaughtMail(locals.db, { limit: SHOWN_MESSAGES }) : null,
		maxAttempts: MAX_ATTEMPTS
	};
};

const messageIdSchema = z.object({ id: z.string().min(1) });

function deliveryNotice({ sent, failed }: { sent: number; failed: number }): string {
	if (sent + failed === 0) return 'No mail was due.';
	const delivered = `${sent} ${sent === 1 ? 'message' : 'messages'} handed to the relay`;
	return failed ? `${delivered}; ${failed} could not be sent.` : `${delivered}.`;
}

export const actions: Actions = {
	retry: async ({ locals, request }) => {
		requireRole(locals, 'admin');
		const posted = await postedForm(request);
		const parsed = messageIdSchema.safeParse(Object.fromEntries(posted ?? []));
		if (!parsed.success) return fail(400, { notice: 'No message given.' });
		const done = retryMail(locals.db, parsed.data.id);
		if (!done.ok) return fail(STATUS_OF_REFUSAL[done.code], { notice: done.message });
		return { notice: 'Queued again; it goes out with the next delivery.' };
	},

	send: async ({ locals }) => {
		requireRole(locals, 'admin');
		return { notice: deliveryNotice(await deliverNow(locals.db)) };
	}
};
