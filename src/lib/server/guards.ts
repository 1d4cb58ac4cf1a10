import { error } from '@sveltejs/kit';
import type { Role } from '../roles';
import { PERMISSIONS, type Permission } from './access';
import type { SessionUser } from './users';

/** The signed-in user, or a 401 that pages show as "sign in" and the API as JSON. */
export function requireUser(locals: App.Locals): SessionUser {
	if (!locals.user) error(401, { code: 'unauthenticated', message: 'Sign in to continue.' });
	return locals.user;
}

/** The signed-in user holding at least one of `roles`, or a 403 naming what is needed. */
export function requireRole(locals: App.Locals, ...roles: Role[]): SessionUser {
	const user = requireUser(locals);
	if (!roles.some((role) => user.roles.includes(role))) {
		error(403, {
			code: 'forbidden',
			message: `This needs the ${roles.join(' or ')} role.`
		});
	}
	return user;
}

/** The signed-in user whose roles grant `permission` (see access.ts), or a 403. */
export function requirePermission(locals: App.Locals, permission: Permission): SessionUser {
	return requireRole(locals, ...PERMISSIONS[permission]);
}
