// Demo alert preferences (invented): every user of the demo starts with the defaults written out, in the
// zone of their organization's first airfield; one operator keeps quiet hours at night and wants the
// switch-on reminder earlier. The alerts themselves come from the evaluation, not from the seed.
import { db } from '@/models';
import type { SeedContext } from './demo';

const CHOICES: Record<string, { quietStart?: string; quietEnd?: string; reminderLeadMinutes?: number }> = {
  'operator2@frostvale.test': { quietStart: '23:00', quietEnd: '05:30', reminderLeadMinutes: 45 },
};

export async function seedAlerts(ctx: SeedContext): Promise<void> {
  const { AlertPreference } = db();
  const rows = ctx.scenario.organizations.flatMap((o) => {
    const zone = o.airfields[0]?.timeZone ?? 'UTC';
    return o.users.map((u) => ({ userId: ctx.userIds[u.email], organizationId: ctx.orgIds[o.key], timeZone: zone, ...(CHOICES[u.email] ?? {}) }));
  });
  await AlertPreference.bulkCreate(rows, { transaction: ctx.transaction });
}
