import type { Role } from '@shared/schemas/common';

export const ROLE_NAMES: Record<Role, string> = { admin: 'Admin', engineer: 'Engineer', viewer: 'Viewer' };
export const ROLE_HELP: Record<Role, string> = {
  admin: 'An admin runs the agency: members, settings, the catalog and its prices, and everything an engineer does.',
  engineer:
    'An engineer keeps the inventory, imports, surveys and treatments, compares alternatives, and builds and publishes plans.',
  viewer: 'A viewer reads published plans, their briefs, and the inventory and its map.',
};
/** The invitation form's field labels (also used in its messages). */
export const INVITE_LABELS = { email: 'E-mail', role: 'Role' };
