import { render, screen, within } from '@testing-library/svelte';
import { describe, expect, it } from 'vitest';
import { liveFigures } from '$lib/campaign/live-figures';
import { seaLevelFacility, seaLevelForm, seaLevelModel } from '$lib/campaign/sea-level-campaign';
import LiveFiguresPanel from './LiveFiguresPanel.svelte';

const panelFor = (form: unknown, chosen = true) =>
	render(LiveFiguresPanel, {
		props: {
			live: liveFigures(form, chosen ? seaLevelModel : undefined, seaLevelFacility)
		}
	});

const panel = () => screen.getByRole('region', { name: 'Figures' });

// The first render loads the panel's components into jsdom, which takes seconds on a busy machine.
describe('LiveFiguresPanel', { timeout: 20_000 }, () => {
	it('shows one row per speed with the figures of ISA sea-level air, up to date', () => {
		panelFor(seaLevelForm);
		expect(panel().getAttribute('aria-busy')).toBe('false');
		const rows = within(panel()).getAllByRole('row').slice(1);
		expect(rows.map((r) => within(r).getAllByRole('cell')[0]!.textContent)).toEqual(['20', '40']);
		// ISO 2533:1975 sea level, ρ = 1.225 kg/m³ and μ = 1.7894e-5 Pa·s: at 40 m/s over the
		// model's 0.88 m, Re = ρVL/μ = 2.41e6 and q = ½ρV² = 980.0 Pa.
		const at40 = rows[1]!;
		expect(at40.querySelector('[data-col=modelRe]')?.textContent).toBe('2.41e6');
		expect(at40.querySelector('[data-col=q]')?.textContent).toBe('980.0');
	});

	it('shows the value the core refuses as the problem, and no figures', () => {
		// Thom/Herriot needs the model's volume, which this model lacks.
		panelFor({ ...seaLevelForm, blockageMethod: 'thom-herriot' });
		expect(within(panel()).getByRole('alert').textContent).toContain(
			'the model volume, which Thom/Herriot needs'
		);
		expect(within(panel()).queryByRole('table')).toBeNull();
	});

	it('asks once for a model and a facility, and shows nothing else until then', () => {
		panelFor(seaLevelForm, false);
		expect(within(panel()).getAllByText(/Choose a scale model/)).toHaveLength(1);
		expect(within(panel()).queryByRole('table')).toBeNull();
		expect(within(panel()).queryByText(/No cautions or limits/)).toBeNull();
	});
});
