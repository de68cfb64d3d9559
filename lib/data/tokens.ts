import 'server-only';
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { Op, type Transaction } from 'sequelize';
import { db } from '@/models';
import type { TokenPurpose } from '@/models/Token';
import { Conflict, Invalid, NotFound } from '@/lib/api/errors';
import { absoluteUrl, tokenDigest } from '@/lib/mail/links';
import { enqueueMail } from '@/lib/mail/outbox';
import { renderInviteMail, renderResetMail } from '@/lib/mail/templates';
import { organizationZone } from '@/lib/alerts/preferences';
import type { Role } from '@/lib/auth/permissions';
import { writeTransaction } from '@/models/transaction';

// Single-use e-mail tokens: invitations (a week) and password resets (an hour). The token is 32 random
// bytes; only its keyed hash is stored. A token is used by one conditional UPDATE (unused and not
// expired), so a second use, an expired one and an unknown one are all refused.

export const TOKEN_TTL_MS: Record<TokenPurpose, number> = { invite: 7 * 24 * 3_600_000, reset: 3_600_000 };
/** At most one reset e-mail per account in this window, however often it is asked for. */
const RESET_WINDOW_MS = 10 * 60_000;

export type TokenProblem = 'invalid' | 'expired' | 'used';
export const TOKEN_PROBLEM_MESSAGE: Record<TokenPurpose, Record<TokenProblem, string>> = {
  invite: {
    invalid: 'This invitation link is not valid. Open it again from the e-mail, or ask your manager for a new invitation.',
    expired: 'This invitation has expired. Ask your manager to send a new one.',
    used: 'This invitation was already used. Sign in with the password you chose, or reset it.',
  },
  reset: {
    invalid: 'This reset link is not valid. Open it again from the e-mail, or ask for a new one.',
    expired: 'This reset link has expired. Ask for a new one.',
    used: 'This reset link was already used. Ask for a new one if you need to.',
  },
};

function newToken(): string {
  return crypto.randomBytes(32).toString('base64url');
}

/** A new token for the user; earlier unused tokens of the same purpose stop working (they expire now). */
export async function createToken({
  orgId,
  userId,
  purpose,
  createdById = null,
  now = new Date(),
  transaction,
}: {
  orgId: number;
  userId: number;
  purpose: TokenPurpose;
  createdById?: number | null;
  now?: Date;
  transaction?: Transaction;
}): Promise<{ token: string; expiresAt: Date }> {
  const { Token } = db();
  await Token.update({ expiresAt: now }, { where: { userId, purpose, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction });
  const token = newToken();
  const expiresAt = new Date(now.getTime() + TOKEN_TTL_MS[purpose]);
  await Token.create({ organizationId: orgId, userId, purpose, tokenHash: tokenDigest(token), expiresAt, createdById }, { transaction });
  return { token, expiresAt };
}

/** What a token link is for, without using it (the page shows the form, or why it cannot). */
export async function inspectToken({ token, purpose, now = new Date() }: { token: string; purpose: TokenPurpose; now?: Date }) {
  const { Token, User } = db();
  const row = await Token.findOne({ where: { tokenHash: tokenDigest(token), purpose } });
  if (!row) return { ok: false as const, problem: 'invalid' as TokenProblem };
  if (row.usedAt) return { ok: false as const, problem: 'used' as TokenProblem };
  if (row.expiresAt.getTime() <= now.getTime()) return { ok: false as const, problem: 'expired' as TokenProblem };
  const user = await User.findOne({ where: { id: row.userId, organizationId: row.organizationId, active: true } });
  if (!user) return { ok: false as const, problem: 'invalid' as TokenProblem };
  return { ok: true as const, user: { id: user.id, name: user.name, email: user.email }, expiresAt: row.expiresAt };
}

/** Uses the token once; any problem is a 422 on the field "token" with words for people. */
async function consumeToken({ token, purpose, now, transaction }: { token: string; purpose: TokenPurpose; now: Date; transaction: Transaction }) {
  const { Token } = db();
  const tokenHash = tokenDigest(token);
  const [n] = await Token.update({ usedAt: now }, { where: { tokenHash, purpose, usedAt: null, expiresAt: { [Op.gt]: now } }, transaction });
  const row = await Token.findOne({ where: { tokenHash, purpose }, transaction });
  if (n !== 1 || !row) {
    const problem: TokenProblem = !row ? 'invalid' : row.usedAt ? 'used' : 'expired';
    throw new Invalid([{ field: 'token', message: TOKEN_PROBLEM_MESSAGE[purpose][problem] }], TOKEN_PROBLEM_MESSAGE[purpose][problem]);
  }
  return row;
}

/** The invitee chooses a password (and may correct their name); the invitation is used up. */
export async function acceptInvitation({ token, password, name, now = new Date() }: { token: string; password: string; name?: string; now?: Date }) {
  const { User } = db();
  const passwordHash = await bcrypt.hash(password, 10);
  return writeTransaction(async (transaction) => {
    const row = await consumeToken({ token, purpose: 'invite', now, transaction });
    const u = await User.findOne({ where: { id: row.userId, organizationId: row.organizationId, active: true }, transaction });
    if (!u) throw new Invalid([{ field: 'token', message: TOKEN_PROBLEM_MESSAGE.invite.invalid }], TOKEN_PROBLEM_MESSAGE.invite.invalid);
    u.passwordHash = passwordHash;
    u.mustChangePassword = false;
    if (name) u.name = name;
    await u.save({ transaction });
    return { email: u.email, name: u.name };
  });
}

/** A new password from a reset link; the link and any other open reset links stop working. */
export async function resetPassword({ token, password, now = new Date() }: { token: string; password: string; now?: Date }) {
  const { User, Token } = db();
  const passwordHash = await bcrypt.hash(password, 10);
  return writeTransaction(async (transaction) => {
    const row = await consumeToken({ token, purpose: 'reset', now, transaction });
    const u = await User.findOne({ where: { id: row.userId, organizationId: row.organizationId, active: true }, transaction });
    if (!u) throw new Invalid([{ field: 'token', message: TOKEN_PROBLEM_MESSAGE.reset.invalid }], TOKEN_PROBLEM_MESSAGE.reset.invalid);
    u.passwordHash = passwordHash;
    u.mustChangePassword = false;
    await u.save({ transaction });
    await Token.update({ usedAt: now }, { where: { userId: u.id, purpose: 'reset', usedAt: null }, transaction });
    return { email: u.email };
  });
}

/**
 * Asks for a reset e-mail. The caller always gets the same answer; only an active account gets the
 * e-mail, at most one per ten minutes.
 */
export async function requestPasswordReset({ email, now = new Date() }: { email: string; now?: Date }): Promise<void> {
  const { User, OutboxMessage } = db();
  const u = await User.findOne({ where: { email } });
  if (!u || !u.active) return;
  const dedupeKey = `reset:u${u.id}:${Math.floor(now.getTime() / RESET_WINDOW_MS)}`;
  if (await OutboxMessage.count({ where: { dedupeKey } })) return;
  const zone = await organizationZone(u.organizationId);
  await writeTransaction(async (transaction) => {
    const { token, expiresAt } = await createToken({ orgId: u.organizationId, userId: u.id, purpose: 'reset', now, transaction });
    const mail = renderResetMail({ name: u.name, url: absoluteUrl(`/reset/${token}`), expiresAt, timeZone: zone });
    await enqueueMail({ organizationId: u.organizationId, userId: u.id, kind: 'reset', to: u.email, mail, dedupeKey, now, transaction });
  });
}

const queuedResets = new Set<Promise<void>>();

/**
 * The reset request as the route makes it: the work (look-up, token, e-mail) is queued and the caller
 * answered at once, so the answer takes the same path and the same time whether or not the address has
 * an account. `then` runs after the work (delivery); failures are logged without the address.
 */
export function queuePasswordReset({ email, then }: { email: string; then?: () => void }): void {
  const p: Promise<void> = requestPasswordReset({ email })
    .then(() => then?.())
    .catch((err) => {
      // Two requests at once for one account: the outbox's unique dedupe key keeps the second e-mail out.
      if ((err as { name?: string })?.name === 'SequelizeUniqueConstraintError') return;
      console.error('[thawline] reset request failed', err instanceof Error ? err.name : 'error');
    })
    .finally(() => queuedResets.delete(p));
  queuedResets.add(p);
}

/** For tests and shutdown: how many queued reset requests are still running, and a wait for them. */
export function queuedResetCount(): number {
  return queuedResets.size;
}
export async function settleQueuedResets(): Promise<void> {
  while (queuedResets.size) await Promise.all([...queuedResets]);
}

/** Writes the invitation token and its e-mail (inside the caller's transaction). */
export async function writeInvitation({
  orgId,
  user,
  inviterId,
  now = new Date(),
  transaction,
}: {
  orgId: number;
  user: { id: number; name: string; email: string; role: Role };
  inviterId: number | null;
  now?: Date;
  transaction: Transaction;
}) {
  const { Organization, User } = db();
  const org = await Organization.findByPk(orgId, { transaction });
  if (!org) throw new NotFound('Organization');
  const inviter = inviterId ? await User.findOne({ where: { id: inviterId, organizationId: orgId }, transaction }) : null;
  const zone = await organizationZone(orgId);
  const { token, expiresAt } = await createToken({ orgId, userId: user.id, purpose: 'invite', createdById: inviterId, now, transaction });
  const mail = renderInviteMail({ name: user.name, orgName: org.name, inviterName: inviter?.name ?? `The managers of ${org.name}`, role: user.role, url: absoluteUrl(`/invite/${token}`), expiresAt, timeZone: zone });
  const outbox = await enqueueMail({ organizationId: orgId, userId: user.id, kind: 'invite', to: user.email, mail, dedupeKey: `invite:u${user.id}:${now.getTime()}`, now, transaction });
  return { expiresAt, outboxId: outbox.id };
}

/** A manager sends a new invitation to someone who has not chosen a password yet. */
export async function resendInvitation({ orgId, actorId, userId, now = new Date() }: { orgId: number; actorId: number; userId: number; now?: Date }) {
  const { User } = db();
  const u = await User.findOne({ where: { id: userId, organizationId: orgId } });
  if (!u) throw new NotFound('User');
  if (!u.active) throw new Conflict('This user is deactivated. Reactivate them first.');
  if (!u.mustChangePassword) throw new Conflict('This user has already chosen a password. They can reset it from the sign-in page.');
  return writeTransaction((transaction) => writeInvitation({ orgId, user: u, inviterId: actorId, now, transaction }));
}
