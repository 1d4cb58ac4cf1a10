import { describe, expect, it } from 'vitest';
import { navFor } from './navigation';
import { homePath, ROLES, type Role } from './roles';

describe('home page by role', () => {
	it.each<[Role[], string]>([
		[['aerodynamicist'], '/campaigns'],
		[['reviewer'], '/review'],
		[['operator'], '/operations'],
		[['admin'], '/admin'],
		[['aerodynamicist', 'reviewer'], '/review'],
		[['operator', 'admin'], '/admin'],
		[[], '/welcome']
	])('%j lands on %s', (roles, path) => {
		expect(homePath(roles)).toBe(path);
	});
});

describe('navigation by role', () => {
	it('shows each role its own pages and nobody pages of roles they lack', () => {
		for (const role of ROLES) {
			for (const item of navFor([role])) expect(item.roles).toContain(role);
		}
		expect(navFor(['aerodynamicist']).map((i) => i.href)).toEqual([
			'/campaigns',
			'/models',
			'/facilities',
			'/invoices',
			'/calendar-feed',
			'/account'
		]);
		// Reviewers judge the test, not its price.
		expect(navFor(['reviewer']).map((i) => i.href)).not.toContain('/invoices');
		expect(navFor([])).toEqual([]);
	});
});
