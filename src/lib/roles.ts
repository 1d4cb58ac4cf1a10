/** What a user may do is the union of the roles they hold. */
export const ROLES = ['aerodynamicist', 'reviewer', 'operator', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
	aerodynamicist: 'Aerodynamicist',
	reviewer: 'Reviewer',
	operator: 'Tunnel operator',
	admin: 'Administrator'
};

/** `staff` is the facility's own people; each client organisation is a `client` team. */
export const TEAM_KINDS = ['staff', 'client'] as const;
export type TeamKind = (typeof TEAM_KINDS)[number];

/** Where a user lands after signing in: the page of their most specific job. */
const HOME_BY_ROLE: [Role, string][] = [
	['admin', '/admin'],
	['operator', '/operations'],
	['reviewer', '/review'],
	['aerodynamicist', '/campaigns']
];

export function homePath(roles: readonly Role[]): string {
	return HOME_BY_ROLE.find(([role]) => roles.includes(role))?.[1] ?? '/welcome';
}

export type TeamRef = { id: string; name: string; kind: TeamKind };

/** The signed-in person as every request sees them: roles and teams read fresh each time. */
export type SessionUser = {
	id: string;
	email: string;
	name: string;
	roles: Role[];
	teams: TeamRef[];
};
