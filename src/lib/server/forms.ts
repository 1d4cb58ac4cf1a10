/**
 * The posted form, or null when the body cannot be read as one (a multipart body that does
 * not match its boundary, a body cut short). Actions answer null with their own 400.
 */
export function postedForm(request: Request): Promise<FormData | null> {
	return request.formData().catch(() => null);
}
