import type { Role } from '@/lib/auth/permissions';
import type { AlertKind } from '@/models/Alert';

/**
 * Who gets each kind of alert, by role (the oil-too-cold warning also goes to the departure's pilot,
 * whatever their role). One typed map, read by the evaluation and the preferences form.
 */
export const ALERT_ROLES: Record<AlertKind, readonly Role[]> = {
  'oil-too-cold': ['operator'],
  'switch-on': ['operator'],
  'cold-night': ['manager'],
};

/** The kinds a user of this role can receive (anyone can be a departure's pilot). */
export function kindsFor(role: Role): AlertKind[] {
  return (['oil-too-cold', 'switch-on', 'cold-night'] as const).filter((k) => k === 'oil-too-cold' || ALERT_ROLES[k].includes(role));
}
