// The mail viewer's data as the data layer returns it and client components show it. Type-only: no I/O.
export type MailKind = 'oil-too-cold' | 'switch-on' | 'cold-night' | 'invite' | 'reset' | 'address-in-use';
export type OutboxStatus = 'pending' | 'sending' | 'sent' | 'failed' | 'expired' | 'cancelled';

export interface CapturedSummary {
  id: number;
  subject: string;
  from: string;
  to: string;
  kind: string | null;
  receivedAt: string;
  sizeBytes: number;
}

export interface CapturedDetail extends CapturedSummary {
  messageId: string | null;
  recipients: string[];
  headers: Record<string, string>;
  text: string;
  html: string;
  raw: string;
  /** True when single-use links were hidden because the viewer is not the recipient. */
  redacted: boolean;
}

export interface OutboxRow {
  id: number;
  kind: string;
  to: string;
  subject: string;
  status: OutboxStatus;
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string;
  sentAt: string | null;
  createdAt: string;
}

export interface OutboxSummary {
  counts: Record<OutboxStatus, number>;
  recent: OutboxRow[];
}

export interface MailViewerData {
  transport: 'smtp' | 'capture';
  /** Times are shown in the organization's zone (its first airfield's). */
  timeZone: string;
  messages: CapturedSummary[];
  outbox: OutboxSummary;
}
