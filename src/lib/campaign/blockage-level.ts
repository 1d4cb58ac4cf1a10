import type { Finding } from '../calc';

export type BlockageLevel = 'good' | 'caution' | 'limit';

/** How the figures' own blockage finding rates the ratio, for colouring it in a picture. */
export function blockageLevel(findings: readonly Finding[]): BlockageLevel {
	if (findings.some((f) => f.code === 'blockage-over-limit')) return 'limit';
	if (findings.some((f) => f.code === 'blockage-high')) return 'caution';
	return 'good';
}
