// Who may enter which part of the app, and the navigation entries that follow from it. The route
// guards in app/(app)/_layout.tsx and every menu read this one table, so a menu never offers a
// screen its guard would refuse.
import type { Href } from 'expo-router';

import type { IconName } from '@/components/ui/icon';
import type { Role } from '@/shared/schemas/session';

export type Area = 'everyone' | 'officer' | 'manager' | 'staff';

const areaRoles: Record<Area, readonly Role[]> = {
  everyone: ['member', 'officer', 'manager'],
  officer: ['officer'],
  manager: ['manager'],
  /** Oversight screens (audit) that both the safety officer and the lab manager read. */
  staff: ['officer', 'manager'],
};

export function canEnter(area: Area, role: Role | undefined): boolean {
  return role !== undefined && areaRoles[area].includes(role);
}

export interface NavEntry {
  /** Becomes the entry's testID: `nav-<name>`. */
  name: string;
  label: string;
  href: Href;
  icon: IconName;
  area: Area;
}

/** The phone's bottom bar, in order. */
export const tabEntries: readonly NavEntry[] = [
  { name: 'today', label: 'Today', href: '/', icon: 'home-lightning-bolt', area: 'everyone' },
  { name: 'gear', label: 'Gear', href: '/gear', icon: 'tools', area: 'everyone' },
  { name: 'scan', label: 'Scan', href: '/scan', icon: 'qrcode-scan', area: 'everyone' },
  { name: 'bookings', label: 'Bookings', href: '/bookings', icon: 'calendar-check', area: 'everyone' },
  { name: 'more', label: 'More', href: '/more', icon: 'dots-horizontal', area: 'everyone' },
];

/** Everything past the bottom bar: on the More screen on a phone, in the side navigation when wide. */
const extraEntries: readonly NavEntry[] = [
  { name: 'planner', label: 'Planner', href: '/planner', icon: 'calculator-variant', area: 'everyone' },
  { name: 'incidents', label: 'Incidents', href: '/incidents', icon: 'alert-octagon', area: 'everyone' },
  { name: 'approvals', label: 'Approvals', href: '/approvals', icon: 'clipboard-check', area: 'officer' },
  { name: 'lab-rules', label: 'Lab rules', href: '/lab-rules', icon: 'book-cog', area: 'officer' },
  { name: 'qualifications', label: 'Qualifications', href: '/qualifications', icon: 'badge-account', area: 'officer' },
  { name: 'people', label: 'People', href: '/people', icon: 'account-group', area: 'manager' },
  { name: 'labels', label: 'Labels', href: '/labels', icon: 'label-multiple', area: 'manager' },
  { name: 'reports', label: 'Reports', href: '/reports', icon: 'chart-bar', area: 'manager' },
  { name: 'outbox', label: 'Outbox', href: '/outbox', icon: 'email-fast', area: 'manager' },
  { name: 'audit', label: 'Audit', href: '/audit', icon: 'history', area: 'staff' },
];

/** Who an area is for, in words: "safety officers", "lab managers". */
export const areaAudience: Record<Area, string> = {
  everyone: 'everyone',
  officer: 'safety officers',
  manager: 'lab managers',
  staff: 'safety officers and lab managers',
};

/** Tools every signed-in person has beyond the bottom bar. */
export function toolEntries(): NavEntry[] {
  return extraEntries.filter((entry) => entry.area === 'everyone');
}

/** The entries that come with the person's role (empty for members). */
export function roleEntries(role: Role | undefined): NavEntry[] {
  return extraEntries.filter((entry) => entry.area !== 'everyone' && canEnter(entry.area, role));
}

/** Whether `pathname` is inside the entry's section (its page or anything under it). */
export function isActive(entry: NavEntry, pathname: string): boolean {
  const href = typeof entry.href === 'string' ? entry.href : entry.href.pathname;
  if (href === '/') return pathname === '/';
  return pathname === href || pathname.startsWith(`${href}/`);
}
