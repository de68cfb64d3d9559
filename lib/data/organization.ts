import 'server-only';
import { db } from '@/models';
import { NotFound } from '@/lib/api/errors';
import { writeTransaction } from '@/models/transaction';
import type { OrganizationPlanning } from '@/lib/validation/organization';

export interface PlanningSettings {
  targetChance: number;
  holdMinutes: number;
}

export async function getPlanningSettings({ orgId }: { orgId: number }): Promise<PlanningSettings> {
  const o = await db().Organization.findByPk(orgId, { attributes: ['id', 'targetChance', 'holdMinutes'] });
  if (!o) throw new NotFound('Organization');
  return { targetChance: o.targetChance, holdMinutes: o.holdMinutes };
}

/** Changes the planning settings; plans recompute because their fingerprint carries the chance. */
export async function updatePlanningSettings({ orgId, patch }: { orgId: number; patch: OrganizationPlanning }): Promise<PlanningSettings> {
  return writeTransaction(async (transaction) => {
    const o = await db().Organization.findByPk(orgId, { transaction });
    if (!o) throw new NotFound('Organization');
    await o.update({ ...(patch.targetChance !== undefined ? { targetChance: patch.targetChance } : {}), ...(patch.holdMinutes !== undefined ? { holdMinutes: patch.holdMinutes } : {}) }, { transaction });
    return { targetChance: o.targetChance, holdMinutes: o.holdMinutes };
  });
}
