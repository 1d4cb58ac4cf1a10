/**
 * What a careless client or an attacker sends: wrong types, huge counts, number-like strings,
 * deep nesting, long and odd Unicode strings, files where text is expected, mismatched content
 * types, and valid bodies with a few fields spoiled so the request reaches validation.
 */
import fc from 'fast-check';

/**
 * A value sent as given: a JSON fragment that JSON.stringify cannot write (NaN, 1e309, depth
 * 10 000) or one too large to print in a counterexample, shown by its label instead.
 */
export class Raw {
	constructor(
		readonly label: string,
		/** The fragment inside a JSON body. */
		readonly json: string,
		/** The value inside a form field. */
		readonly text: string = json,
		/** The value superforms' devalue encoding carries, when there is one. */
		readonly value?: unknown
	) {}
	[fc.toStringMethod](): string {
		return `Raw(${this.label})`;
	}
}

/** A file part, in a multipart body where a text field is expected or a file is. */
export class FilePart {
	constructor(
		readonly name: string,
		readonly type: string,
		readonly content: string | Raw
	) {}
	[fc.toStringMethod](): string {
		const content =
			this.content instanceof Raw ? this.content.label : JSON.stringify(this.content.slice(0, 40));
		return `File(${JSON.stringify(this.name)}, ${this.type}, ${content})`;
	}
}

const MIB = 1024 * 1024;

const numberToken = (json: string, value: number) => new Raw(json, json, json, value);
const NUMBER_TOKENS = [
	numberToken('NaN', NaN),
	numberToken('Infinity', Infinity),
	numberToken('-Infinity', -Infinity),
	numberToken('1e309', Infinity),
	numberToken('-1e309', -Infinity),
	numberToken('-0', -0),
	numberToken('1e-400', 0),
	new Raw('01', '01'),
	new Raw('0x1F', '0x1F'),
	new Raw('.5', '.5'),
	new Raw('undefined', 'undefined'),
	new Raw("'single'", "'single'"),
	numberToken('123456789012345678901234567890', 1.2345678901234568e29)
];

const HUGE_COUNTS = [
	3e7,
	2 ** 32,
	2 ** 31,
	2 ** 53 + 2,
	1e9,
	1e308,
	Number.MAX_VALUE,
	Number.MIN_VALUE,
	-1,
	-(2 ** 31),
	0,
	0.5,
	1e-9,
	10_000,
	250_001
];

const NUMBER_LIKE = ['NaN', 'Infinity', '-Infinity', '1e309', '-0', '0x10', '1_000', ' 7 ', ''];
const MORE_NUMBER_LIKE = ['1e-400', '٣', '1,5', '+1', '.5', '5.', 'null', 'true', '9'.repeat(400)];
const ODD_STRINGS = [
	'\u202e\u200fdaolnwod\u202c',
	'🌬️💨🛩️',
	'👨‍👩‍👧‍👦',
	'\ud800',
	'x\udfffy',
	'a\u0000b',
	'\u0000',
	'\r\n\t',
	'\ufeffBOM',
	'<script>alert(1)</script>',
	"'; DROP TABLE campaign;--",
	'../../../../etc/passwd',
	'%00%2e%2e',
	'e\u0301\u0301\u0301',
	'2026-02-30T25:61',
	'0000-00-00',
	'+275760-09-13T00:00:00.001Z'
];

function distinct(count: number, from: number, to: number): Raw {
	const step = (to - from) / count;
	const values = Array.from({ length: count }, (_, i) => from + i * step);
	return new Raw(
		`${count} distinct numbers in [${from}, ${to})`,
		`[${values.join(',')}]`,
		values.join(','),
		values
	);
}

function longString(label: string, text: string): Raw {
	return new Raw(label, JSON.stringify(text), text, text);
}

/** Built once: values of a megabyte are costly to make on every run. */
const BULK = [
	longString('1 MiB of "x"', 'x'.repeat(MIB)),
	longString('0.9 MiB of "x"', 'x'.repeat(900 * 1024)),
	longString('0.4 MiB of "é" and emoji', 'é🌬'.repeat(70_000)),
	longString('100 kB of RTL marks and NULs', '\u200f\u0000'.repeat(50_000)),
	new Raw('arrays nested 10000 deep', '['.repeat(10_000) + ']'.repeat(10_000)),
	new Raw('objects nested 10000 deep', '{"a":'.repeat(10_000) + '1' + '}'.repeat(10_000)),
	distinct(10_000, 1, 100),
	distinct(100_000, -180, 180),
	distinct(5_000, -90, 90),
	new Raw(
		'20000 zeros',
		`[${Array(20_000).fill(0).join(',')}]`,
		Array(20_000).fill(0).join(','),
		Array(20_000).fill(0)
	)
];

export const nastyScalar: fc.Arbitrary<unknown> = fc.oneof(
	{ weight: 4, arbitrary: fc.constantFrom(...HUGE_COUNTS) },
	{ weight: 3, arbitrary: fc.constantFrom(...NUMBER_LIKE, ...MORE_NUMBER_LIKE) },
	{ weight: 3, arbitrary: fc.constantFrom(...ODD_STRINGS) },
	{ weight: 2, arbitrary: fc.constantFrom(...NUMBER_TOKENS) },
	{ weight: 2, arbitrary: fc.string({ unit: 'binary', maxLength: 30 }) },
	{ weight: 1, arbitrary: fc.constantFrom(null, true, false) }
);

export const nastyValue: fc.Arbitrary<unknown> = fc.oneof(
	{ weight: 8, arbitrary: nastyScalar },
	{ weight: 2, arbitrary: fc.jsonValue({ maxDepth: 2 }) },
	// Fresh copies: the bodies are spoiled in place, and one shared {} could end up inside itself.
	{
		weight: 1,
		arbitrary: fc
			.constantFrom([], {}, [null], { value: 'NaN', unit: 'm' })
			.map((v) => structuredClone(v))
	},
	{ weight: 1, arbitrary: fc.constantFrom(...BULK) }
);

const KEYS = ['__proto__', 'constructor', 'toString', '', 'id', 'extra', 'value', 'unit', 'rows'];
export const nastyKey = fc.oneof(
	{ weight: 2, arbitrary: fc.constantFrom(...KEYS) },
	{ weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 12 }) }
);

/** JSON text of a value that may hold raw fragments. */
export function jsonText(value: unknown): string {
	if (value instanceof Raw) return value.json;
	if (Array.isArray(value)) return `[${value.map(jsonText).join(',')}]`;
	if (value && typeof value === 'object')
		return `{${Object.entries(value)
			.map(([key, v]) => `${JSON.stringify(key)}:${jsonText(v)}`)
			.join(',')}}`;
	return JSON.stringify(value) ?? 'null';
}

/** A value as a form field carries it. */
export function formText(value: unknown): string {
	if (value instanceof Raw) return value.text;
	if (typeof value === 'string') return value;
	if (typeof value === 'number') return String(value);
	return jsonText(value);
}

/**
 * superforms' `__superform_json` encoding (devalue's flattened array), written here so the fuzz
 * can also carry NaN, ±Infinity and -0, which devalue sends as the negative codes -3 to -6.
 */
export function devalueText(root: unknown): string {
	const table: unknown[] = [];
	const add = (value: unknown): number => {
		if (value instanceof Raw) return add(value.value !== undefined ? value.value : value.text);
		if (value === undefined) return -1;
		if (typeof value === 'number') {
			if (Number.isNaN(value)) return -3;
			if (value === Infinity) return -4;
			if (value === -Infinity) return -5;
			if (Object.is(value, -0)) return -6;
		}
		const index = table.push(null) - 1;
		table[index] = Array.isArray(value)
			? value.map(add)
			: value && typeof value === 'object'
				? Object.fromEntries(Object.entries(value).map(([k, v]) => [k, add(v)]))
				: value;
		return index;
	};
	const index = add(root);
	return index < 0 ? String(index) : JSON.stringify(table);
}
