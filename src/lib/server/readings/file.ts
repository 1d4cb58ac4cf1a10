import Papa from 'papaparse';
import type { ReadingProblem } from '../../readings/types';
import { READINGS_MAX_ROWS, readingsBodySchema } from '../../schemas/readings';

/** The file as lower-case header names and rows of cells in the header's order. */
export type ReadingsTable = {
	format: 'csv' | 'json';
	delimiter: string | null;
	headers: string[];
	/** Each record with the row number a person sees in a spreadsheet. */
	records: { row: number; cells: unknown[] }[];
};

export type TableOutcome =
	{ ok: true; table: ReadingsTable } | { ok: false; problems: ReadingProblem[] };

const whole = (reason: string): TableOutcome => ({
	ok: false,
	problems: [{ row: null, column: null, reason }]
});

const DELIMITERS = [',', ';', '\t'] as const;
const DELIMITER_NAMES: Record<string, string> = { ',': 'comma', ';': 'semicolon', '\t': 'tab' };

/** Cells split by the header line's most frequent separator outside quotes. */
function detectDelimiter(headerLine: string): string | null {
	const counts = new Map<string, number>(DELIMITERS.map((d) => [d, 0]));
	let quoted = false;
	for (const ch of headerLine) {
		if (ch === '"') quoted = !quoted;
		else if (!quoted && counts.has(ch)) counts.set(ch, counts.get(ch)! + 1);
	}
	const [best, n] = [...counts].sort((a, b) => b[1] - a[1])[0]!;
	return n > 0 ? best : null;
}

/** Spreadsheets that separate with `;` or tab write decimal commas: `-2,5` means −2.5. */
const DECIMAL_COMMA = /^\s*([+-]?\d*),(\d+(?:[eE][+-]?\d+)?)\s*$/;

function decode(bytes: Uint8Array): string | null {
	// A NUL byte or invalid UTF-8 means the file is not text (a workbook, an image, …).
	if (bytes.subarray(0, 8192).includes(0)) return null;
	try {
		return new TextDecoder('utf-8', { fatal: true, ignoreBOM: false }).decode(bytes);
	} catch {
		return null;
	}
}

/**
 * Reads the bytes of a CSV file into a table. Papa Parse works through the text in slices and
 * pauses between them, so a large file leaves the event loop free for other requests.
 */
export async function readCsv(bytes: Uint8Array): Promise<TableOutcome> {
	if (bytes.length === 0) return whole('The file is empty.');
	const decoded = decode(bytes);
	if (decoded === null)
		return whole('The file is not text: save the sheet as CSV (UTF-8) and upload that.');
	const text = decoded.replace(/^\uFEFF/, '');
	const firstLine = text.slice(0, text.search(/\r?\n|$/));
	if (!firstLine.trim()) return whole('The file has no header line.');
	const delimiter = detectDelimiter(firstLine);
	if (delimiter === null)
		return whole(
			'The header line has a single column: separate the columns with commas, semicolons or tabs.'
		);

	let headers: string[] | null = null;
	const records: ReadingsTable['records'] = [];
	const decimalComma = delimiter !== ',';
	let row = 0;
	let refusal: TableOutcome | null = null;
	await new Promise<void>((done) => {
		Papa.parse<string[]>(text, {
			delimiter,
			chunkSize: 256 * 1024,
			chunk: (results: Papa.ParseResult<string[]>, parser: Papa.Parser) => {
				for (const cells of results.data) {
					row++;
					if (headers === null) {
						headers = cells.map((h: string) => h.trim().toLowerCase());
						continue;
					}
					if (cells.every((c: string) => c.trim() === '')) continue;
					if (records.length >= READINGS_MAX_ROWS) {
						refusal = whole(
							`The file has more than ${READINGS_MAX_ROWS.toLocaleString('en-GB')} readings; split it.`
						);
						break;
					}
					if (cells.length > headers.length) {
						refusal = {
							ok: false,
							problems: [
								{
									row,
									column: null,
									reason: `has ${cells.length} cells but the header names ${headers.length} columns (separator: ${DELIMITER_NAMES[delimiter]})`
								}
							]
						};
						break;
					}
					if (decimalComma)
						for (let i = 0; i < cells.length; i++)
							if (DECIMAL_COMMA.test(cells[i]!))
								cells[i] = cells[i]!.replace(DECIMAL_COMMA, '$1.$2');
					records.push({ row, cells });
				}
				const quoting = results.errors.find((e: Papa.ParseError) => e.type === 'Quotes');
				if (quoting && !refusal)
					refusal = {
						ok: false,
						problems: [{ row: (quoting.row ?? 0) + 1, column: null, reason: quoting.message }]
					};
				if (refusal) return parser.abort();
				parser.pause();
				setImmediate(() => parser.resume());
			},
			complete: () => done()
		});
	});
	return (
		refusal ?? { ok: true, table: { format: 'csv', delimiter, headers: headers ?? [], records } }
	);
}

/** Reads a JSON body, `[{…}, …]` or `{ "readings": [{…}, …] }`, into the same table shape. */
export function readJsonReadings(bytes: Uint8Array): TableOutcome {
	if (bytes.length === 0) return whole('The body is empty.');
	const text = decode(bytes);
	if (text === null) return whole('The body is not UTF-8 text.');
	let raw: unknown;
	try {
		raw = JSON.parse(text.replace(/^\uFEFF/, ''));
	} catch {
		return whole('The body is not valid JSON.');
	}
	const parsed = readingsBodySchema.safeParse(raw);
	if (!parsed.success)
		return whole(
			`Send an array of readings, or an object with a "readings" array of at most ${READINGS_MAX_ROWS.toLocaleString('en-GB')} objects.`
		);
	const items = Array.isArray(parsed.data) ? parsed.data : parsed.data.readings;
	const headers: string[] = [];
	const column = new Map<string, number>();
	const records = items.map((item, i) => {
		const cells: unknown[] = [];
		for (const [key, value] of Object.entries(item)) {
			const name = key.trim().toLowerCase();
			if (!column.has(name)) {
				column.set(name, headers.length);
				headers.push(name);
			}
			cells[column.get(name)!] = value;
		}
		return { row: i + 1, cells };
	});
	return { ok: true, table: { format: 'json', delimiter: null, headers, records } };
}
