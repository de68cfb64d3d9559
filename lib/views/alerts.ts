// Alerts and alert preferences as the data layer returns them and client components show them.
// Type-only: no I/O.
import type { AlertData, AlertKind, Audience } from '@/lib/alerts/content';

export type AlertChannel = 'email' | 'app' | 'off';

/** A user's alert preferences (a user without a stored row has the defaults). */
export interface Preferences {
  oilTooCold: 'email' | 'app';
  switchOn: AlertChannel;
  coldNight: AlertChannel;
  emailEnabled: boolean;
  quietStart: string | null;
  quietEnd: string | null;
  timeZone: string;
  reminderLeadMinutes: number;
}

export type EmailState = 'sent' | 'queued' | 'held' | 'failed' | 'not-sent' | 'app-only';

export interface AlertView {
  id: number;
  kind: AlertKind;
  title: string;
  audience: Audience;
  revision: number;
  createdAt: string;
  acknowledgedAt: string | null;
  resolvedAt: string | null;
  link: string;
  data: AlertData;
  email: { state: EmailState; at: string | null };
}

export interface PreferencesView extends Preferences {
  /** The kinds this user can receive (the form shows only these). */
  kinds: AlertKind[];
  tempUnit: 'C' | 'F';
}
