import { render, screen } from '@testing-library/svelte';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import NumberListInput from './NumberListInput.svelte';

describe('NumberListInput', () => {
	it('shows SI values in the unit typed and binds typed values back in SI', async () => {
		let bound = [0.1, 0.25];
		render(NumberListInput, {
			props: {
				get value() {
					return bound;
				},
				set value(v: number[]) {
					bound = v;
				},
				unit: 'mm',
				si: 'm',
				'aria-label': 'Row heights'
			}
		});
		const input = screen.getByLabelText<HTMLInputElement>('Row heights');
		// 1 mm = 0.001 m exactly (NIST SP 811 appendix B).
		expect(input.value).toBe('100, 250');
		await userEvent.clear(input);
		await userEvent.type(input, '20; 40 60');
		expect(bound).toEqual([0.02, 0.04, 0.06]);
	});

	it('keeps the last good list and names the entry that is not a number', async () => {
		let bound = [1, 2];
		render(NumberListInput, {
			props: {
				get value() {
					return bound;
				},
				set value(v: number[]) {
					bound = v;
				},
				unit: 'm',
				si: 'm',
				'aria-label': 'Speeds'
			}
		});
		const input = screen.getByLabelText<HTMLInputElement>('Speeds');
		await userEvent.type(input, ', x3');
		expect(bound).toEqual([1, 2]);
		expect(screen.getByRole('alert').textContent).toContain('“x3” is not a number.');
	});
});
