import { render, screen } from '@testing-library/svelte';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import NumberListInput from './NumberListInput.svelte';

/** Mounts the input bound to a list, as `bind:value` would, and returns the binding. */
function mount(initial: number[], unit: string, si: string) {
	const bound = { value: initial };
	render(NumberListInput, {
		props: {
			get value() {
				return bound.value;
			},
			set value(v: number[]) {
				bound.value = v;
			},
			unit,
			si,
			'aria-label': 'List'
		}
	});
	return { bound, input: screen.getByLabelText<HTMLInputElement>('List') };
}

describe('NumberListInput', () => {
	it('shows SI values in the unit typed and binds typed values back in SI', async () => {
		const { bound, input } = mount([0.1, 0.25], 'mm', 'm');
		// 1 mm = 0.001 m exactly (NIST SP 811 appendix B).
		expect(input.value).toBe('100, 250');
		await userEvent.clear(input);
		await userEvent.type(input, '20; 40 60');
		expect(bound.value).toEqual([0.02, 0.04, 0.06]);
	});

	it('keeps the separator being typed when the bound list comes back as a copy', async () => {
		let list = $state([30, 40]);
		render(NumberListInput, {
			props: {
				get value() {
					return list;
				},
				set value(v: number[]) {
					// As a form store does: the parent keeps a copy, not the array it was given.
					list = [...v];
				},
				unit: 'm/s',
				si: 'm/s',
				'aria-label': 'Speeds'
			}
		});
		const input = screen.getByLabelText<HTMLInputElement>('Speeds');
		await userEvent.type(input, ', 42');
		expect(input.value).toBe('30, 40, 42');
		expect(list).toEqual([30, 40, 42]);
	});

	it('keeps the last good list and names the entry that is not a number', async () => {
		const { bound, input } = mount([1, 2], 'm', 'm');
		await userEvent.type(input, ', x3');
		expect(bound.value).toEqual([1, 2]);
		expect(screen.getByRole('alert').textContent).toContain('“x3” is not a number.');
	});
});
