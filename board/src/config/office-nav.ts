import type { Role } from '@baytime/shared';
import { paths } from './paths';

export type OfficeRole = Extract<Role, 'owner' | 'foreman' | 'advisor'>;

export interface NavEntry {
  label: string;
  path: string;
  roles: readonly OfficeRole[];
  /** Planned page: shown in the navigation as coming. */
  coming?: boolean;
}

export interface NavGroup {
  label?: string;
  entries: readonly NavEntry[];
}

const ALL: readonly OfficeRole[] = ['owner', 'foreman', 'advisor'];
const LEADS: readonly OfficeRole[] = ['owner', 'foreman'];
const OWNER: readonly OfficeRole[] = ['owner'];

/** The office navigation; the same roles guard the routes. */
export const OFFICE_NAV: readonly NavGroup[] = [
  {
    entries: [
      { label: 'Floor', path: paths.floor, roles: ALL },
      { label: 'Dispatch', path: paths.dispatch, roles: ALL },
      { label: 'Repair orders', path: paths.repairOrders, roles: ALL },
      { label: 'Findings', path: paths.findings, roles: ALL },
      { label: 'Timecards', path: paths.timecards, roles: LEADS },
      { label: 'Exceptions', path: paths.exceptions, roles: LEADS },
      { label: 'Offline punches', path: paths.offlinePunches, roles: LEADS },
      { label: 'Reports', path: paths.reports, roles: LEADS },
    ],
  },
  {
    label: 'Admin',
    entries: [
      { label: 'Users', path: paths.admin.users, roles: OWNER },
      { label: 'Bays', path: paths.admin.bays, roles: OWNER },
      { label: 'Operations menu', path: paths.admin.operations, roles: OWNER },
      { label: 'Wall screens', path: paths.admin.screens, roles: LEADS },
      { label: 'Kiosks', path: paths.admin.kiosks, roles: LEADS },
      { label: 'Shop settings', path: paths.admin.shop, roles: OWNER },
      { label: 'Integration keys', path: paths.admin.integrationKeys, roles: OWNER },
      { label: 'Webhooks', path: paths.admin.webhooks, roles: OWNER },
      { label: 'Sent messages', path: paths.admin.mailbox, roles: OWNER },
    ],
  },
];

export function rolesFor(path: string): readonly OfficeRole[] | undefined {
  for (const group of OFFICE_NAV)
    for (const entry of group.entries) if (entry.path === path) return entry.roles;
  return undefined;
}

export function navFor(role: OfficeRole): NavGroup[] {
  return OFFICE_NAV.map((group) => ({
    ...group,
    entries: group.entries.filter((entry) => entry.roles.includes(role)),
  })).filter((group) => group.entries.length > 0);
}
