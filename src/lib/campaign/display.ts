import { toSignificant } from '../calc/significant';

/** A Reynolds number to three significant figures in engineering form: 1.53e6. */
export function formatRe(re: number): string {
	if (re === 0) return '0';
	const exponent = Math.floor(Math.log10(Math.abs(re)));
	const mantissa = Number(toSignificant(re / 10 ** exponent, 3));
	// Rounding can carry into the next decade (9.996e5 → 10.0e5).
	return mantissa >= 10
		? `${(mantissa / 10).toFixed(2)}e${exponent + 1}`
		: `${mantissa.toFixed(2)}e${exponent}`;
}

/** A duration as hours and minutes: 37 h 05 min. */
export function formatDuration(seconds: number): string {
	const minutes = Math.round(seconds / 60);
	const h = Math.floor(minutes / 60);
	const m = minutes % 60;
	return h ? `${h} h ${String(m).padStart(2, '0')} min` : `${m} min`;
}
