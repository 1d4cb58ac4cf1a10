import { render, screen } from '@testing-library/svelte';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import QuantityInput from './QuantityInput.svelte';

function renderBound(start: number | null, si: string, units: string[]) {
	const box = { value: start as number | null | undefined };
	render(QuantityInput, {
		props: {
			get value() {
				return box.value;
			},
			set value(v: number | null | undefined) {
				box.value = v;
			},
			si,
			units,
			'aria-label': 'Quantity'
		}
	});
	return { box, input: screen.getByLabelText<HTMLInputElement>('Quantity') };
}

describe('QuantityInput', () => {
	it('shows the SI value in the unit chosen and binds what is typed back in SI', async () => {
		// T/K = t/°C + 273.15 and t/°F = 1.8·t/°C + 32 (NIST SP 811, 2008, B.8).
		const { box, input } = renderBound(293.15, 'K', ['C', 'K', 'F']);
		expect(input.value).toBe('20');
		await userEvent.clear(input);
		await userEvent.type(input, '25');
		expect(box.value).toBeCloseTo(298.15, 10);
		await userEvent.selectOptions(screen.getByLabelText('Unit'), 'F');
		expect(input.value).toBe('77');
	});

	it('offers a fraction in percent', async () => {
		const { box, input } = renderBound(0.55, 'fraction', ['%']);
		expect(input.value).toBe('55');
		await userEvent.clear(input);
		await userEvent.type(input, '40');
		expect(box.value).toBeCloseTo(0.4, 12);
	});

	it('binds an empty field as no value', async () => {
		const { box, input } = renderBound(1200, 'm', ['m', 'ft']);
		await userEvent.clear(input);
		expect(box.value).toBeNull();
		expect(input.value).toBe('');
	});
});
