import { render, screen } from '@testing-library/svelte';
import userEvent from '@testing-library/user-event';
import { createRawSnippet } from 'svelte';
import { describe, expect, it } from 'vitest';
import SortHeader from './SortHeader.svelte';
import { ListSort } from './sorting.svelte';

type Tunnel = { name: string; maxSpeed_mps: number };
// Invented rows for ordering only; no physics is checked here.
const TUNNELS: Tunnel[] = [
	{ name: 'Tunnel 10', maxSpeed_mps: 40 },
	{ name: 'Tunnel 2', maxSpeed_mps: 65 },
	{ name: 'Tunnel 1', maxSpeed_mps: 50 }
];

function headers(sort: ListSort<Tunnel>) {
	const text = (words: string) =>
		createRawSnippet(() => ({ render: () => `<span>${words}</span>` }));
	const row = document.body.appendChild(document.createElement('table')).createTHead().insertRow();
	render(SortHeader<Tunnel>, {
		target: row,
		props: { sort, key: 'name', children: text('Tunnel') }
	});
	render(SortHeader<Tunnel>, {
		target: row,
		props: { sort, key: 'maxSpeed_mps', numeric: true, children: text('Speed') }
	});
	const header = (name: string) => screen.getByRole('columnheader', { name: new RegExp(name) });
	return {
		header,
		button: (name: string) => screen.getByRole('button', { name: new RegExp(name) })
	};
}

describe('SortHeader with ListSort', () => {
	it('marks the sorted column and flips its direction on a second click', async () => {
		const sort = new ListSort<Tunnel>('name');
		const { header, button } = headers(sort);
		expect(header('Tunnel').getAttribute('aria-sort')).toBe('ascending');
		expect(header('Speed').getAttribute('aria-sort')).toBe('none');
		expect(sort.apply(TUNNELS).map((t) => t.name)).toEqual(['Tunnel 1', 'Tunnel 2', 'Tunnel 10']);

		await userEvent.click(button('Tunnel'));
		expect(header('Tunnel').getAttribute('aria-sort')).toBe('descending');
		expect(sort.apply(TUNNELS).map((t) => t.name)).toEqual(['Tunnel 10', 'Tunnel 2', 'Tunnel 1']);
	});

	it('starts another column ascending, whatever the last one was', async () => {
		const sort = new ListSort<Tunnel>('name');
		const { header, button } = headers(sort);
		await userEvent.click(button('Tunnel'));
		await userEvent.click(button('Speed'));
		expect(header('Speed').getAttribute('aria-sort')).toBe('ascending');
		expect(header('Tunnel').getAttribute('aria-sort')).toBe('none');
		expect(sort.apply(TUNNELS).map((t) => t.maxSpeed_mps)).toEqual([40, 50, 65]);
		expect(header('Speed').classList.contains('text-right')).toBe(true);
	});
});
