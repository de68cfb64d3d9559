import type { Permission } from '@/lib/auth/permissions';

export interface NavItem {
  href: string;
  label: string;
  icon: 'board' | 'map' | 'airfield' | 'aircraft' | 'departure' | 'oil' | 'alert' | 'curve' | 'report' | 'settings' | 'users' | 'mail';
  permission: Permission;
  /** Shown in the phone's bottom bar (the rest go under "More"). */
  primary?: boolean;
  /** A live count beside the label. */
  badge?: 'alerts';
}

// The sections of the product; each is shown to the roles that hold its permission.
export const NAV: NavItem[] = [
  { href: '/board', label: 'Morning board', icon: 'board', permission: 'plans:manage', primary: true },
  { href: '/departures', label: 'Departures', icon: 'departure', permission: 'departures:book-own', primary: true },
  { href: '/map', label: 'Site map', icon: 'map', permission: 'org:read', primary: true },
  { href: '/airfields', label: 'Airfields', icon: 'airfield', permission: 'org:read' },
  { href: '/aircraft', label: 'Aircraft', icon: 'aircraft', permission: 'org:read' },
  { href: '/soak', label: 'Soak forecast', icon: 'curve', permission: 'simulate' },
  { href: '/oil-log', label: 'Oil log', icon: 'oil', permission: 'oil-log:write' },
  { href: '/season', label: 'Season report', icon: 'report', permission: 'plans:manage' },
  { href: '/calibration', label: 'Fit from log', icon: 'curve', permission: 'aircraft:edit' },
  { href: '/devices', label: 'Devices', icon: 'settings', permission: 'aircraft:edit' },
  { href: '/alerts', label: 'Alerts', icon: 'alert', permission: 'org:read', primary: true, badge: 'alerts' },
  { href: '/admin/users', label: 'Users', icon: 'users', permission: 'users:manage' },
  { href: '/mail', label: 'Mail capture', icon: 'mail', permission: 'mail:view' },
  { href: '/settings', label: 'Settings', icon: 'settings', permission: 'org:read' },
];
