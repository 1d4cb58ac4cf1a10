/** A file-name stem from a campaign name: letters, digits, dots and dashes only. */
export const fileStem = (name: string) =>
	name.replace(/[^\w.-]+/g, '-').replace(/^-|-$/g, '') || 'campaign';

/** A CSV the browser saves as `<campaign>-<suffix>` rather than shows. */
export function csvDownload(csv: string, campaignName: string, suffix: string): Response {
	return new Response(csv, {
		headers: {
			'content-type': 'text/csv; charset=utf-8',
			'content-disposition': `attachment; filename="${fileStem(campaignName)}-${suffix}"`
		}
	});
}
