import { setError, superValidate } from 'sveltekit-superforms';
import { zod4 } from 'sveltekit-superforms/adapters';
import type { z } from 'zod';

/**
 * The posted form, or null when the body cannot be read as one (a multipart body that does
 * not match its boundary, a body cut short). Actions answer null with their own 400.
 */
export function postedForm(request: Request): Promise<FormData | null> {
	return request.formData().catch(() => null);
}

export const UNREADABLE_FORM =
	'The form could not be read: its fields do not have the shape this form sends. Reload the page and try again.';

type FormSchema = z.ZodObject;

/**
 * superValidate for a posted form, with two guards added. A body whose shape is not the form's
 * (a list where a group belongs, a group missing, a variant the form does not have) comes back
 * as the empty form with a form-level error instead of as the posted data: only a client other
 * than our own pages sends one, and superforms either throws on it or hands it back for the page
 * to render, which the components are not written to survive. A list longer than the form
 * allows comes back cut to the allowed length, its error kept: echoing 50 000 entries back costs
 * the server more time than reading them.
 */
export async function validatePosted<S extends FormSchema>(
	posted: Request | FormData | null,
	schema: S,
	options: { id?: string } = {}
) {
	const adapter = zod4(schema);
	const form = posted && (await superValidate(posted, adapter, options).catch(() => null));
	if (form?.valid) return form;
	const issues = form ? (schema.safeParse(form.data).error?.issues ?? []) : [];
	if (form && !issues.some((issue) => isMisshapen(issue, form.data))) {
		for (const issue of issues)
			if (issue.code === 'too_big' && issue.origin === 'array')
				cutList(form.data, issue.path, Number(issue.maximum));
		return form;
	}
	const empty = await superValidate(adapter, { ...options, errors: false });
	setError(empty, '', UNREADABLE_FORM);
	return empty;
}

function isMisshapen(issue: z.core.$ZodIssue, data: unknown): boolean {
	return (
		issue.code === 'invalid_union' ||
		(issue.code === 'invalid_type' &&
			(issue.expected === 'object' ||
				issue.expected === 'array' ||
				isGroup(valueAt(data, issue.path))))
	);
}

function cutList(data: unknown, path: readonly PropertyKey[], maximum: number) {
	const list = valueAt(data, path);
	if (Array.isArray(list) && Number.isFinite(maximum)) list.length = Math.max(0, maximum);
}

function isGroup(value: unknown): boolean {
	return typeof value === 'object' && value !== null && !(value instanceof File);
}

function valueAt(data: unknown, path: readonly PropertyKey[]): unknown {
	let at = data;
	for (const key of path) {
		if (!isGroup(at)) return undefined;
		at = (at as Record<PropertyKey, unknown>)[key];
	}
	return at;
}
