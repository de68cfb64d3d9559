import 'server-only';
import crypto from 'node:crypto';
import bcrypt from 'bcryptjs';
import { db } from '@/models';
import { Conflict, Forbidden, Invalid, NotFound } from '@/lib/api/errors';
import type { Role } from '@/lib/auth/permissions';
import { TOKEN_TTL_MS, writeInvitation } from './tokens';
import { enqueueMail } from '@/lib/mail/outbox';
import { renderAddressInUseMail } from '@/lib/mail/templates';
import { writeTransaction } from '@/models/transaction';

export interface UserRow {
  id: number;
  name: string;
  email: string;
  role: Role;
  active: boolean;
  mustChangePassword: boolean;
  createdAt: string;
}

function row(u: InstanceType<ReturnType<typeof db>['User']>): UserRow {
  return {
    id: u.id,
    name: u.name,
    email: u.email,
    role: u.role,
    active: u.active,
    mustChangePassword: u.mustChangePassword,
    createdAt: u.createdAt.toISOString(),
  };
}

export async function getOrganization({ orgId }: { orgId: number }) {
  const { Organization } = db();
  const org = await Organization.findByPk(orgId);
  if (!org) throw new NotFound('Organization');
  return org;
}

export async function listUsers({ orgId }: { orgId: number }): Promise<UserRow[]> {
  const { User } = db();
  const users = await User.findAll({ where: { organizationId: orgId }, order: [['active', 'DESC'], ['name', 'ASC']] });
  return users.map(row);
}

/**
 * An address that already has an account. In this organization: a 409 (the manager sees its users anyway).
 * In another organization: the caller gets the answer a free address gets (201, the same fields; the id
 * is never part of the answer, see AddedUser), nothing is written to this organization, and the
 * address's owner is told by e-mail (in their own organization's outbox, so this manager's mail viewer
 * does not show it). What stays visible to the manager is that no new row appears in their users list.
 */
async function addressTaken({ orgId, email, name, role }: { orgId: number; email: string; name: string; role: Role }): Promise<AddedUser | null> {
  const { User, Organization } = db();
  const existing = await User.findOne({ where: { email } });
  if (!existing) return null;
  if (existing.organizationId === orgId) throw new Conflict('That e-mail address is already in use.');
  const org = await Organization.findByPk(orgId);
  const now = new Date();
  await enqueueMail({
    organizationId: existing.organizationId,
    userId: existing.id,
    kind: 'address-in-use',
    to: existing.email,
    mail: renderAddressInUseMail({ name: existing.name, orgName: org?.name ?? 'another organization' }),
    dedupeKey: `address-in-use:u${existing.id}:o${orgId}:${Math.floor(now.getTime() / 86_400_000)}`,
    now,
  });
  return { name, email, role, active: true, mustChangePassword: true, createdAt: now.toISOString() };
}

/** What adding a user answers: the row without its id (an id would tell a taken address from a free one). */
export type AddedUser = Omit<UserRow, 'id'>;

function added(u: UserRow): AddedUser {
  const { id: _id, ...rest } = u;
  return rest;
}

export async function createUser({ orgId, name, email, role, temporaryPassword }: { orgId: number; name: string; email: string; role: Role; temporaryPassword: string }) {
  const { User } = db();
  const passwordHash = await bcrypt.hash(temporaryPassword, 10);
  const taken = await addressTaken({ orgId, email, name, role });
  if (taken) return taken;
  // The check runs under the write lock, so of simultaneous requests for one address one wins, the rest are 409.
  return writeTransaction(async (transaction) => {
    const existing = await User.findOne({ where: { email }, transaction });
    // Only reached in a race for a new address (one wins): the address is now this organization's.
    if (existing) throw new Conflict('That e-mail address is already in use.');
    const u = await User.create({ organizationId: orgId, name, email, role, passwordHash, mustChangePassword: true }, { transaction });
    return added(row(u));
  });
}

/**
 * Adds a user by e-mail invitation: the account, a single-use invitation token and its e-mail are
 * written in one transaction. Nobody knows the account's password until the invitee chooses one.
 */
export async function inviteUser({ orgId, inviterId, name, email, role, now = new Date() }: { orgId: number; inviterId: number; name: string; email: string; role: Role; now?: Date }) {
  const { User } = db();
  const passwordHash = await bcrypt.hash(crypto.randomBytes(32).toString('base64url'), 10);
  const taken = await addressTaken({ orgId, email, name, role });
  if (taken) return { ...taken, invitation: { expiresAt: new Date(now.getTime() + TOKEN_TTL_MS.invite).toISOString() } };
  return writeTransaction(async (transaction) => {
    // Again under the write lock: of simultaneous invitations of one address one wins, the rest are 409.
    if (await User.findOne({ where: { email }, attributes: ['id'], transaction })) throw new Conflict('That e-mail address is already in use.');
    const u = await User.create({ organizationId: orgId, name, email, role, passwordHash, mustChangePassword: true }, { transaction });
    const invitation = await writeInvitation({ orgId, user: u, inviterId, now, transaction });
    return { ...added(row(u)), invitation: { expiresAt: invitation.expiresAt.toISOString() } };
  });
}

export async function updateUser({ orgId, actorId, userId, role, active }: { orgId: number; actorId: number; userId: number; role?: Role; active?: boolean }) {
  const { User } = db();
  return writeTransaction(async (transaction) => {
    const u = await User.findOne({ where: { id: userId, organizationId: orgId }, transaction });
    if (!u) throw new NotFound('User');
    if (u.id === actorId && (active === false || (role && role !== 'manager'))) {
      throw new Forbidden('You cannot remove your own manager role or deactivate yourself.');
    }
    if (role) u.role = role;
    if (active !== undefined) u.active = active;
    await u.save({ transaction });
    return row(u);
  });
}

export async function changePassword({ userId, currentPassword, newPassword }: { userId: number; currentPassword: string; newPassword: string }) {
  const { User } = db();
  const u = await User.findByPk(userId);
  if (!u) throw new NotFound('User');
  if (!(await bcrypt.compare(currentPassword, u.passwordHash))) {
    throw new Invalid([{ field: 'currentPassword', message: 'That is not your current password.' }]);
  }
  u.passwordHash = await bcrypt.hash(newPassword, 10);
  u.mustChangePassword = false;
  await u.save();
}

export async function updatePreferences({ userId, ...prefs }: { userId: number; tempUnit?: 'C' | 'F'; volumeUnit?: 'L' | 'qt'; name?: string }) {
  const { User } = db();
  const u = await User.findByPk(userId);
  if (!u) throw new NotFound('User');
  if (prefs.tempUnit) u.tempUnit = prefs.tempUnit;
  if (prefs.volumeUnit) u.volumeUnit = prefs.volumeUnit;
  if (prefs.name) u.name = prefs.name;
  await u.save();
  return { tempUnit: u.tempUnit, volumeUnit: u.volumeUnit, name: u.name };
}
