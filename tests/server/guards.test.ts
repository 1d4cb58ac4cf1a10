import { isHttpError } from '@sveltejs/kit';
import { describe, expect, it } from 'vitest';
import { requirePermission, requireRole, requireUser } from '../../src/lib/server/guards';
import { ROLES, type Role, type SessionUser } from '../../src/lib/roles';

function localsWith(roles: Role[] | null): App.Locals {
	const user: SessionUser | null = roles
		? { id: 'u1', email: 'u@example.org', name: 'U', roles, teams: [] }
		: null;
	return { user } as App.Locals;
}

function statusOf(run: () => unknown): number {
	try {
		run();
		return 200;
	} catch (thrown) {
		if (isHttpError(thrown)) return thrown.status;
		throw thrown;
	}
}

describe('requireRole', () => {
	it('answers 401 signed out, whatever role is asked for', () => {
		for (const role of ROLES) expect(statusOf(() => requireRole(localsWith(null), role))).toBe(401);
		expect(statusOf(() => requireUser(localsWith(null)))).toBe(401);
	});

	it('lets through exactly the holders of one of the roles asked for', () => {
		for (const held of ROLES) {
			for (const needed of ROLES) {
				expect(statusOf(() => requireRole(localsWith([held]), needed))).toBe(
					held === needed ? 200 : 403
				);
			}
		}
		expect(statusOf(() => requireRole(localsWith(['reviewer']), 'operator', 'reviewer'))).toBe(200);
		expect(statusOf(() => requireRole(localsWith([]), 'aerodynamicist'))).toBe(403);
	});
});

describe('requirePermission', () => {
	it('answers as requireRole for the roles a permission names', () => {
		// Operators and admins keep the calendar (product rule, booking).
		const expected: Record<Role, number> = {
			aerodynamicist: 403,
			reviewer: 403,
			operator: 200,
			admin: 200
		};
		for (const role of ROLES)
			expect(statusOf(() => requirePermission(localsWith([role]), 'book-tunnel-time'))).toBe(
				expected[role]
			);
		expect(statusOf(() => requirePermission(localsWith(null), 'book-tunnel-time'))).toBe(401);
	});
});
