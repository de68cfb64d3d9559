// Roles and what each may do: one typed map, read by every guard (no if-chains on role names).
import { ROLES, type Role } from '@/lib/roles';

export { ROLES, type Role };

export type Permission =
  | 'org:read' // read the organization's airfields, shelters, aircraft, forecasts
  | 'users:manage' // list, add, change role, deactivate users
  | 'airfields:edit' // airfields, shelters, tariffs
  | 'aircraft:edit' // aircraft profiles, heaters, calibration
  | 'plans:manage' // heat plans: recompute, confirm; the Morning board
  | 'departures:book-any' // book for any aircraft and pilot
  | 'departures:book-own' // book aircraft the user may fly
  | 'oil-log:write'
  | 'mail:view' // the local mail capture viewer
  | 'simulate'; // the what-if Soak forecast and the simulation API

export const PERMISSIONS: Record<Role, readonly Permission[]> = {
  manager: ['org:read', 'users:manage', 'airfields:edit', 'aircraft:edit', 'plans:manage', 'departures:book-any', 'departures:book-own', 'oil-log:write', 'mail:view', 'simulate'],
  operator: ['org:read', 'aircraft:edit', 'plans:manage', 'departures:book-any', 'departures:book-own', 'oil-log:write', 'simulate'],
  pilot: ['org:read', 'departures:book-own', 'oil-log:write', 'simulate'],
};

export function can(role: Role, permission: Permission): boolean {
  return PERMISSIONS[role].includes(permission);
}

/** Where each role lands after signing in. */
export const HOME: Record<Role, string> = {
  manager: '/map',
  operator: '/board',
  pilot: '/departures',
};

export const ROLE_LABEL: Record<Role, string> = {
  manager: 'Manager',
  operator: 'Operator',
  pilot: 'Pilot',
};
