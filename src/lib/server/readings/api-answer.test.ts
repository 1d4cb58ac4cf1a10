import { describe, expect, it } from 'vitest';
import { refuse } from '../outcome';
import { declaredMediaType, readingsRefusalAnswer, sentFileName } from './api-answer';

describe('the readings API’s reading of a request', () => {
	it('takes CSV, plain text as CSV and JSON, whatever the parameters and case', () => {
		expect(declaredMediaType('text/csv; charset=utf-8')).toBe('text/csv');
		expect(declaredMediaType('Text/Plain')).toBe('text/csv');
		expect(declaredMediaType('application/json')).toBe('application/json');
		expect(declaredMediaType('application/vnd.ms-excel')).toBeUndefined();
		expect(declaredMediaType(null)).toBeUndefined();
	});

	it('names the file as sent, or by its type when the name is missing or does not decode', () => {
		expect(sentFileName(encodeURIComponent('Lauf 3 – Ebene B.csv'), 'text/csv')).toBe(
			'Lauf 3 – Ebene B.csv'
		);
		expect(sentFileName(null, 'application/json')).toBe('readings.json');
		expect(sentFileName('%E0%A4%A', 'text/csv')).toBe('readings.csv');
		expect(sentFileName('x'.repeat(300), 'text/csv')).toHaveLength(200);
	});

	it('answers a refused file with its status and problems under the error', () => {
		const problems = [{ row: 2, column: 'unit', reason: 'is required' }];
		expect(
			readingsRefusalAnswer({ ...refuse('invalid', 'bad'), problems, problemCount: 1 })
		).toEqual({
			status: 400,
			body: { error: { code: 'invalid-readings', message: 'bad', problems, problemCount: 1 } }
		});
		expect(readingsRefusalAnswer({ ...refuse('conflict', 'read'), points: [3] }).status).toBe(409);
	});
});
