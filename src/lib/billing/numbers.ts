/** An invoice or credit-note number as printed: four digits at least, in the facility's sequence. */
export function documentNumber(n: number): string {
	return String(n).padStart(4, '0');
}
