/**
 * Request bodies for the fuzz: a route's valid sample with a few parts spoiled, or something
 * else entirely, each encoded one way and labelled with a content type that may not match.
 */
import fc from 'fast-check';
import {
	devalueText,
	FilePart,
	formText,
	jsonText,
	nastyKey,
	nastyScalar,
	nastyValue,
	Raw
} from './fuzz-arbitraries';

/** What a route takes when used right: the fuzz spoils it, so validation is reached. */
export type Sample =
	| { kind: 'json'; value: unknown }
	| { kind: 'text'; text: string; mediaType: string }
	| { kind: 'form'; fields: [string, string | FilePart][] }
	/** A superforms form posted as JavaScript posts it: the data devalue-encoded in one field. */
	| { kind: 'superform'; value: unknown }
	| { kind: 'none' };

export type Field = [string, unknown];

export type Body =
	| { encoding: 'json'; value: unknown }
	| { encoding: 'text'; text: string | Raw }
	| { encoding: 'urlencoded' | 'multipart'; fields: Field[] }
	| { encoding: 'none' };

type Path = (string | number)[];

function paths(value: unknown, at: Path = []): Path[] {
	if (value instanceof Raw || value === null || typeof value !== 'object') return [at];
	const children = Array.isArray(value) ? value.map((_, i) => i) : Object.keys(value);
	return [
		at,
		...children.flatMap((key) => paths((value as Record<string, unknown>)[key], [...at, key]))
	];
}

type Mutation =
	| { kind: 'replace'; at: number; value: unknown }
	| { kind: 'remove'; at: number }
	| { kind: 'add'; at: number; key: string; value: unknown }
	| { kind: 'repeat'; at: number; times: number };

const mutation: fc.Arbitrary<Mutation> = fc.oneof(
	{
		weight: 6,
		arbitrary: fc.record({ kind: fc.constant('replace'), at: fc.nat(), value: nastyValue })
	},
	{ weight: 2, arbitrary: fc.record({ kind: fc.constant('remove'), at: fc.nat() }) },
	{
		weight: 1,
		arbitrary: fc.record({
			kind: fc.constant('add'),
			at: fc.nat(),
			key: nastyKey,
			value: nastyValue
		})
	},
	{
		weight: 1,
		arbitrary: fc.record({
			kind: fc.constant('repeat'),
			at: fc.nat(),
			times: fc.constantFrom(1000, 5000, 20_000)
		})
	}
) as fc.Arbitrary<Mutation>;

/** The sample with the mutations applied in turn; node `at` counts over the current tree. */
function mutate(sample: unknown, mutations: Mutation[]): unknown {
	const box: Record<string, unknown> = { root: structuredClone(sample) };
	for (const m of mutations) {
		const all = paths(box.root).map((p) => ['root', ...p]);
		const path = all[m.at % all.length]!;
		const parent = path.slice(0, -1).reduce<unknown>((node, key) => (node as never)[key], box) as
			Record<string | number, unknown> | unknown[];
		const key = path.at(-1)!;
		const node = (parent as Record<string | number, unknown>)[key];
		if (m.kind === 'replace') (parent as Record<string | number, unknown>)[key] = m.value;
		else if (m.kind === 'remove') {
			if (Array.isArray(parent)) parent.splice(Number(key), 1);
			else delete (parent as Record<string, unknown>)[key];
		} else if (m.kind === 'add') {
			if (Array.isArray(node)) node.push(m.value);
			else if (node && typeof node === 'object' && !(node instanceof Raw))
				(node as Record<string, unknown>)[m.key] = m.value;
		} else if (Array.isArray(node) && node.length) {
			const element = jsonText(node[0]);
			(parent as Record<string | number, unknown>)[key] = new Raw(
				`${m.times} × ${element.slice(0, 60)}`,
				`[${Array(m.times).fill(element).join(',')}]`
			);
		}
	}
	return box.root;
}

const spoiled = (sample: unknown) =>
	fc.array(mutation, { minLength: 1, maxLength: 3 }).map((ms) => mutate(sample, ms));

const TEXT_BODIES = ['', ' ', 'null', '{', '[]', '"x"', 'NaN', '<a><b/></a>', '\u0000', 'a=1&a=2'];
const textBody = fc.oneof(
	fc.constantFrom(...TEXT_BODIES),
	fc.string({ unit: 'binary', maxLength: 60 }),
	nastyValue.map((v) => new Raw(`JSON of ${fc.stringify(v).slice(0, 60)}`, jsonText(v)))
);

const FILE_CONTENT = fc.oneof(
	fc.constantFrom('', 'a,b\n1,2\n', '%PDF-1.4\n', '<svg onload="alert(1)"/>', '\u0000\u0001'),
	fc.constantFrom(...['x'.repeat(64 * 1024)].map((t) => new Raw('64 kB of "x"', t)))
);
const filePart = fc
	.record({
		name: fc.constantFrom('readings.csv', 'a.json', '', '../../x.png', 'ü🌬.pdf', 'x'.repeat(300)),
		type: fc.constantFrom('text/csv', 'application/json', 'application/octet-stream', ''),
		content: FILE_CONTENT
	})
	.map(({ name, type, content }) => new FilePart(name, type, content));

const formValue: fc.Arbitrary<unknown> = fc.oneof(
	{ weight: 6, arbitrary: nastyValue },
	{ weight: 1, arbitrary: filePart }
);

const SUPERFORM_FIELDS = ['__superform_json', '__superform_id', '__superform_file_name'];

type FieldMutation =
	| { kind: 'replace' | 'add'; at: number; name: string; value: unknown }
	| { kind: 'remove' | 'duplicate'; at: number };

const fieldMutation: fc.Arbitrary<FieldMutation> = fc.oneof(
	{
		weight: 5,
		arbitrary: fc.record({
			kind: fc.constantFrom('replace', 'add'),
			at: fc.nat(),
			name: fc.oneof(fc.constantFrom(...SUPERFORM_FIELDS), nastyKey),
			value: formValue
		})
	},
	{
		weight: 2,
		arbitrary: fc.record({ kind: fc.constantFrom('remove', 'duplicate'), at: fc.nat() })
	}
) as fc.Arbitrary<FieldMutation>;

function mutateFields(fields: Field[], mutations: FieldMutation[]): Field[] {
	const out = [...fields];
	for (const m of mutations) {
		const at = out.length ? m.at % out.length : 0;
		if (m.kind === 'add') out.push([m.name, m.value]);
		else if (!out.length) continue;
		else if (m.kind === 'replace') out[at] = [out[at]![0], m.value];
		else if (m.kind === 'remove') out.splice(at, 1);
		else out.push(out[at]!);
	}
	return out;
}

const spoiledFields = (fields: Field[]) =>
	fc.array(fieldMutation, { minLength: 1, maxLength: 3 }).map((ms) => mutateFields(fields, ms));

const formEncoding = fc.constantFrom('urlencoded' as const, 'multipart' as const);

function superformFields(value: unknown): Field[] {
	return [['__superform_json', new Raw('devalue of the form', devalueText(value))]];
}

/** A body for a route with this sample: mostly the sample spoiled, sometimes anything at all. */
export function bodyFor(sample: Sample): fc.Arbitrary<Body> {
	const anything: fc.Arbitrary<Body> = fc.oneof(
		nastyValue.map((value) => ({ encoding: 'json' as const, value })),
		textBody.map((text) => ({ encoding: 'text' as const, text })),
		fc
			.record({
				encoding: formEncoding,
				fields: fc.array(fc.tuple(nastyKey, formValue), { maxLength: 4 })
			})
			.map((b) => b as Body),
		fc.constant({ encoding: 'none' as const })
	);
	const near: fc.Arbitrary<Body> =
		sample.kind === 'json'
			? spoiled(sample.value).map((value) => ({ encoding: 'json' as const, value }))
			: sample.kind === 'text'
				? fc
						.tuple(nastyScalar, fc.nat())
						.map(([v, at]) => insertCell(sample.text, formText(v), at))
						.map((text) => ({ encoding: 'text' as const, text }))
				: sample.kind === 'form'
					? fc
							.tuple(formEncoding, spoiledFields(sample.fields))
							.map(([encoding, fields]) => ({ encoding, fields }))
					: sample.kind === 'superform'
						? fc
								.tuple(
									formEncoding,
									spoiled(sample.value),
									fc.array(fieldMutation, { maxLength: 2 })
								)
								.map(([encoding, value, ms]) => ({
									encoding,
									fields: mutateFields(superformFields(value), ms)
								}))
						: anything;
	return fc.oneof({ weight: 3, arbitrary: near }, { weight: 1, arbitrary: anything });
}

/** A CSV with one cell swapped for the nasty value: row and column counted from `at`. */
function insertCell(csv: string, cell: string, at: number): string {
	const rows = csv.split('\n').map((row) => row.split(','));
	const row = rows[1 + (at % Math.max(1, rows.length - 1))] ?? rows[0]!;
	row[Math.floor(at / rows.length) % row.length] = cell;
	return rows.map((r) => r.join(',')).join('\n');
}

/** The sample itself, unspoiled, in its own encoding. */
export function sampleBody(sample: Sample): Body {
	if (sample.kind === 'json') return { encoding: 'json', value: sample.value };
	if (sample.kind === 'text') return { encoding: 'text', text: sample.text };
	if (sample.kind === 'form') return { encoding: 'urlencoded', fields: sample.fields };
	if (sample.kind === 'superform')
		return { encoding: 'urlencoded', fields: superformFields(sample.value) };
	return { encoding: 'none' };
}

function formData(fields: Field[]): FormData {
	const data = new FormData();
	for (const [name, value] of fields) {
		if (value instanceof FilePart) {
			const content = value.content instanceof Raw ? value.content.text : value.content;
			data.append(name, new Blob([content], { type: value.type }), value.name);
		} else data.append(name, formText(value));
	}
	return data;
}

/** The body's bytes and the content type its encoding calls for. */
export async function encode(body: Body): Promise<{ bytes: Uint8Array; mediaType: string | null }> {
	const text = (t: string) => new TextEncoder().encode(t);
	if (body.encoding === 'none') return { bytes: new Uint8Array(0), mediaType: null };
	if (body.encoding === 'json')
		return { bytes: text(jsonText(body.value)), mediaType: 'application/json' };
	if (body.encoding === 'text')
		return {
			bytes: text(body.text instanceof Raw ? body.text.json : body.text),
			mediaType: 'text/plain'
		};
	if (body.encoding === 'urlencoded') {
		const params = new URLSearchParams();
		for (const [name, value] of body.fields)
			params.append(name, value instanceof FilePart ? value.name : formText(value));
		return { bytes: text(params.toString()), mediaType: 'application/x-www-form-urlencoded' };
	}
	const response = new Response(formData(body.fields));
	return {
		bytes: new Uint8Array(await response.arrayBuffer()),
		mediaType: response.headers.get('content-type')
	};
}

/** The content-type header sent: the body's own most often, else a wrong or broken one. */
export const contentTypeChoice: fc.Arbitrary<'own' | 'none' | string> = fc.oneof(
	{ weight: 6, arbitrary: fc.constant('own') },
	{
		weight: 3,
		arbitrary: fc.constantFrom(
			'application/json',
			'text/plain',
			'application/xml',
			'multipart/form-data',
			'multipart/form-data; boundary=',
			'multipart/form-data; boundary=zzz',
			'application/x-www-form-urlencoded',
			'text/csv',
			'application/json; charset=utf-16',
			'APPLICATION/JSON',
			'application/x-sveltekit-formdata',
			'application/octet-stream',
			'text/html',
			''
		)
	},
	{ weight: 1, arbitrary: fc.constant('none') }
);
