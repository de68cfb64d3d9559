// Every e-mail Thawline sends, as one EmailDoc each, rendered to HTML and plain text by lib/mail/layout.
// Alerts read their sentences from lib/alerts/content (the same ones the alerts page shows), in the
// recipient's units and the airfield's local times.
import { ALERT_KIND_LABEL, describeAlert, type AlertData, type AlertKind, type Audience } from '@/lib/alerts/content';
import { CAUTIONS } from '@/lib/alerts/safety';
import { ROLE_LABEL, type Role } from '@/lib/auth/permissions';
import type { TempUnit } from '@/lib/units';
import { formatDateTime, zoneLabel } from '@/lib/time';
import { renderHtml, renderText, type EmailDoc } from './layout';
import { absoluteUrl, oneClickUnsubscribeUrl, unsubscribeUrl } from './links';

export interface RenderedMail {
  subject: string;
  text: string;
  html: string;
  headers?: Record<string, string>;
}

function render(doc: EmailDoc, headers?: Record<string, string>): RenderedMail {
  return { subject: doc.subject, text: renderText(doc), html: renderHtml(doc), ...(headers ? { headers } : {}) };
}

export interface AlertRecipient {
  id: number;
  name: string;
  email: string;
  tempUnit: TempUnit;
  audience: Audience;
}

const REASON: Record<AlertKind, (a: Audience) => string> = {
  'oil-too-cold': (a) =>
    a === 'pilot'
      ? 'You get this oil-too-cold warning because you are the pilot of this departure in Thawline.'
      : 'You get this oil-too-cold warning as an operator of the airfield in Thawline.',
  'switch-on': () => 'You get switch-on reminders as an operator, for heaters that are switched on by hand.',
  'cold-night': () => "You get the cold-night notice as a manager, when tonight's forecast low is below your organization's threshold.",
};

const UNSUBSCRIBE_LABEL: Record<AlertKind, string> = {
  'oil-too-cold': 'Stop oil-too-cold warnings by e-mail',
  'switch-on': 'Stop switch-on reminders by e-mail',
  'cold-night': 'Stop cold-night notices by e-mail',
};

/** The page an alert leads to, for its reader. */
export function alertLink(kind: AlertKind, audience: Audience): { path: string; label: string } {
  if (kind === 'oil-too-cold' && audience === 'pilot') return { path: '/departures', label: 'Open your departures' };
  return { path: '/board', label: 'Open the Morning board' };
}

export function renderAlertMail(kind: AlertKind, data: AlertData, to: AlertRecipient, opts: { nowMs: number; changed?: boolean }): RenderedMail {
  const d = describeAlert(kind, data, { unit: to.tempUnit, audience: to.audience, nowMs: opts.nowMs });
  const link = alertLink(kind, to.audience);
  const label = ALERT_KIND_LABEL[kind];
  const subject = `${opts.changed ? 'Updated: ' : ''}${d.title}`;
  const doc: EmailDoc = {
    subject,
    preheader: d.intro[0] ?? d.title,
    label: opts.changed ? `${label} · updated` : label,
    tone: kind === 'cold-night' ? 'ice' : 'heat',
    title: d.title,
    intro: opts.changed ? ['The prediction has changed since the last message.', ...d.intro] : d.intro,
    facts: d.facts,
    sections: d.sections,
    table: d.table,
    action: { label: link.label, url: absoluteUrl(link.path) },
    secondary: { label: 'See all your alerts in Thawline', url: absoluteUrl('/alerts') },
    cautions: [...CAUTIONS[kind]],
    reason: REASON[kind](to.audience),
    preferencesUrl: absoluteUrl('/alerts#preferences'),
    unsubscribe: { url: unsubscribeUrl(to.id, kind), label: UNSUBSCRIBE_LABEL[kind] },
  };
  return render(doc, {
    'List-Unsubscribe': `<${oneClickUnsubscribeUrl(to.id, kind)}>`,
    'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
  });
}

function localExpiry(at: Date, zone: string): string {
  return `${formatDateTime(at.getTime(), zone)} ${zoneLabel(zone, at.getTime())}`;
}

export function renderInviteMail(p: { name: string; orgName: string; inviterName: string; role: Role; url: string; expiresAt: Date; timeZone: string }): RenderedMail {
  const role = ROLE_LABEL[p.role].toLowerCase();
  return render({
    subject: `${p.inviterName} invited you to ${p.orgName} on Thawline`,
    preheader: `Choose a password to start using Thawline as ${role === 'operator' ? 'an' : 'a'} ${role}.`,
    label: 'Invitation',
    tone: 'ice',
    title: `Welcome to Thawline, ${p.name}`,
    intro: [
      `${p.inviterName} added you to ${p.orgName} as ${role === 'operator' ? 'an' : 'a'} ${role}. Thawline forecasts how each parked engine's oil cools overnight and plans when the preheaters must switch on, so the oil is warm enough for the first flight.`,
      'Choose your password to finish setting up your account.',
    ],
    action: { label: 'Choose your password', url: p.url },
    afterAction: [`The link works once and expires on ${localExpiry(p.expiresAt, p.timeZone)}. If it has expired, ask ${p.inviterName} to send a new invitation.`],
    cautions: [...CAUTIONS.account],
    reason: `You get this e-mail because a manager of ${p.orgName} entered this address. If you did not expect it, you can ignore it: no account is usable until a password is chosen.`,
  });
}

export function renderResetMail(p: { name: string; url: string; expiresAt: Date; timeZone: string }): RenderedMail {
  return render({
    subject: 'Reset your Thawline password',
    preheader: 'A link to choose a new password. It works once.',
    label: 'Password reset',
    tone: 'ice',
    title: 'Choose a new password',
    intro: [`Hello ${p.name}, someone (we hope you) asked to reset the password of your Thawline account.`],
    action: { label: 'Choose a new password', url: p.url },
    afterAction: [
      `The link works once and expires on ${localExpiry(p.expiresAt, p.timeZone)}.`,
      'If you did not ask for this, ignore this e-mail: your password stays as it is.',
    ],
    cautions: [...CAUTIONS.account],
    reason: 'You get this e-mail because a password reset was asked for this address on Thawline.',
  });
}

/**
 * To the owner of an address that a manager of another organization tried to add: that manager is
 * answered as for a free address (nothing tells them the address has an account), so the owner hears of
 * it here and can tell them to use another address.
 */
export function renderAddressInUseMail(p: { name: string; orgName: string }): RenderedMail {
  return render({
    subject: `Someone tried to add this address to ${p.orgName} on Thawline`,
    preheader: 'Your account is unchanged.',
    label: 'Account notice',
    tone: 'ice',
    title: 'Your address was offered to another organization',
    intro: [
      `Hello ${p.name}, a manager of ${p.orgName} tried to add this e-mail address to their organization on Thawline.`,
      'One address can belong to one Thawline account, and yours already has one, so nothing was added and your account is unchanged. If you want to join them, ask them to invite another address of yours.',
    ],
    action: { label: 'Sign in to Thawline', url: absoluteUrl('/signin') },
    afterAction: ['If you do not know them, you can ignore this e-mail.'],
    cautions: [...CAUTIONS.account],
    reason: 'You get this e-mail because your address was entered on Thawline by a manager of another organization.',
  });
}
