import { ROLES, type Role } from './roles';

export type NavItem = {
	href:
		| '/campaigns'
		| '/models'
		| '/review'
		| '/operations'
		| '/facilities'
		| '/invoices'
		| '/admin'
		| '/admin/outbox'
		| '/calendar-feed'
		| '/account';
	label: string;
	roles: readonly Role[];
};

/** The header's links; each shows to users holding one of its roles. Pages check again. */
export const NAV_ITEMS: readonly NavItem[] = [
	{ href: '/campaigns', label: 'Campaigns', roles: ['aerodynamicist'] },
	{ href: '/models', label: 'Scale models', roles: ['aerodynamicist'] },
	{ href: '/review', label: 'Review queue', roles: ['reviewer'] },
	{ href: '/operations', label: 'Tunnel schedule', roles: ['operator'] },
	{
		href: '/facilities',
		label: 'Facilities',
		roles: ['aerodynamicist', 'reviewer', 'operator', 'admin']
	},
	{ href: '/invoices', label: 'Invoices', roles: ['aerodynamicist', 'operator', 'admin'] },
	{
		href: '/calendar-feed',
		label: 'Calendar feed',
		roles: ['aerodynamicist', 'reviewer', 'operator', 'admin']
	},
	{ href: '/admin', label: 'People', roles: ['admin'] },
	{ href: '/admin/outbox', label: 'Outbox', roles: ['admin'] },
	{ href: '/account', label: 'Account', roles: ROLES }
];

export function navFor(roles: readonly Role[]): NavItem[] {
	return NAV_ITEMS.filter((item) => item.roles.some((r) => roles.includes(r)));
}
