import { message, setError, type SuperValidated } from 'sveltekit-superforms';
import { refuse, STATUS_OF_REFUSAL, type Refusal } from './outcome';
import type { BaseVersion, StaleRefusal } from './versions';

/** The form field an edit page posts beside its data: the version it was opened at. */
export const BASE_VERSION_FIELD = 'baseVersion';

/** The version an edit form says it was opened at; null when it says none. */
export function postedBaseVersion(posted: FormData | null): BaseVersion | null {
	const raw = posted?.get(BASE_VERSION_FIELD);
	return typeof raw === 'string' && /^\d{1,15}$/.test(raw) ? Number(raw) : null;
}

/** An edit form that does not say what it read could silently overwrite another's edit. */
export function withBaseVersion<T>(
	base: BaseVersion | null,
	save: (base: BaseVersion) => T
): T | Refusal {
	return base === null
		? refuse(
				'invalid',
				'The form did not say which version it was opened at. Reload the page and make the change again.'
			)
		: save(base);
}

/**
 * A refused save, answered on the form. A stale version keeps the user's values and tells them
 * who changed what (409: a form cannot carry If-Match, so 412 would be the wrong word); other
 * refusals land on `field`, or on the form as a whole.
 */
export function refusedForm<T extends Record<string, unknown>>(
	form: SuperValidated<T>,
	refusal: Refusal | StaleRefusal,
	field = ''
) {
	if ('stale' in refusal) return message(form, { stale: refusal.stale }, { status: 409 });
	return setError(form, field as '', refusal.message, { status: STATUS_OF_REFUSAL[refusal.code] });
}
