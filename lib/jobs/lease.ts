// Job leases in the database: one conditional UPDATE takes or renews a lease (expired, or already
// ours), so of several app instances on one database exactly one holds each job at a time. Portable
// Sequelize calls only (no dialect-specific SQL).
import { Op } from 'sequelize';
import { db } from '@/models';

/** Makes sure the lease row exists (another instance creating it at the same time is fine). */
export async function ensureLease(name: string) {
  const { Lease } = db();
  if (await Lease.findByPk(name, { attributes: ['name'] })) return;
  try {
    await Lease.create({ name, holder: '', expiresAt: new Date(0), runs: 0 });
  } catch (err) {
    if ((err as { name?: string }).name !== 'SequelizeUniqueConstraintError') throw err;
  }
}

/** Takes or renews the lease for `ttlMs`; true when `holder` now holds it. */
export async function acquireLease({ name, holder, ttlMs, now = new Date() }: { name: string; holder: string; ttlMs: number; now?: Date }): Promise<boolean> {
  const { Lease } = db();
  await ensureLease(name);
  const [n] = await Lease.update(
    { holder, expiresAt: new Date(now.getTime() + ttlMs) },
    { where: { name, [Op.or]: [{ expiresAt: { [Op.lt]: now } }, { holder }] } },
  );
  return n === 1;
}

/** Records a finished run (only the holder can). */
export async function recordRun({ name, holder, now = new Date() }: { name: string; holder: string; now?: Date }) {
  const { Lease, sequelize } = db();
  await Lease.update({ lastRunAt: now, runs: sequelize.literal('runs + 1') as unknown as number }, { where: { name, holder } });
}

/** Gives the lease up at once (a clean shutdown), so another instance can take over without waiting. */
export async function releaseLease({ name, holder }: { name: string; holder: string }) {
  const { Lease } = db();
  await Lease.update({ expiresAt: new Date(0) }, { where: { name, holder } });
}
