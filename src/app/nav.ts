import type { Role } from '@shared/schemas/common';

export type NavItem = { to: string; label: string; roles: Role[]; catcherOnly?: boolean; group: 'work' | 'admin' };

// What each role sees in the rail. Viewers read the network, roads and
// published plans; admins also run the agency.
export const NAV: NavItem[] = [
  { to: 'network', label: 'Network', roles: ['admin', 'engineer', 'viewer'], group: 'work' },
  { to: 'roads', label: 'Roads', roles: ['admin', 'engineer', 'viewer'], group: 'work' },
  { to: 'imports', label: 'Imports', roles: ['admin', 'engineer'], group: 'work' },
  { to: 'catalog', label: 'Catalog', roles: ['admin', 'engineer'], group: 'work' },
  { to: 'compare', label: 'Compare', roles: ['admin', 'engineer'], group: 'work' },
  { to: 'forecast', label: 'Forecast', roles: ['admin', 'engineer'], group: 'work' },
  { to: 'plans', label: 'Plans', roles: ['admin', 'engineer', 'viewer'], group: 'work' },
  { to: 'members', label: 'Members', roles: ['admin'], group: 'admin' },
  { to: 'settings', label: 'Settings', roles: ['admin'], group: 'admin' },
  { to: 'activity', label: 'Activity', roles: ['admin'], group: 'admin' },
  { to: 'sent-mail', label: 'Sent mail', roles: ['admin'], catcherOnly: true, group: 'admin' },
];

export function navFor(role: Role, mailCatcher: boolean) {
  return NAV.filter((n) => n.roles.includes(role) && (!n.catcherOnly || mailCatcher));
}
