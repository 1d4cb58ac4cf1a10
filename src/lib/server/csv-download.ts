/** A file-name stem from a name people gave: letters, digits, dots and dashes only. */
export const fileStem = (name: string) =>
	name.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'campaign';

/** A CSV the browser saves as `<name>-<suffix>` rather than shows. */
export function csvDownload(csv: string, name: string, suffix: string): Response {
	return new Response(csv, {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${fileStem(name)}-${suffix}"`
		}
	});
}

/**
 * Free text for a CSV cell that a spreadsheet will open: a leading =, +, -, @, tab or carriage
 * return would make it a formula, so such text gets an apostrophe in front (OWASP, "CSV
 * Injection"). Numbers are written as they are and never pass through here.
 */
export const spreadsheetText = (text: string) => (/^[=+\-@\t\r]/.test(text) ? `'${text}` : text);
