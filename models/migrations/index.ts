import type { QueryInterface } from 'sequelize';
import * as m001 from './001-foundation';
import * as m002 from './002-forecasts';
import * as m003 from './003-planning';
import * as m004 from './004-logs-and-oil';
import * as m005 from './005-alerts-mail';
import * as m006 from './006-plan-unique';
import * as m007 from './007-session-version';
import * as m008 from './008-rate-limits';
import * as m008w from './008-start-window';
import * as m009 from './009-outcomes';
import * as m010 from './010-devices';
import * as m011 from './011-plan-chance';

export interface Migration {
  name: string;
  up: (p: { context: QueryInterface }) => Promise<void>;
  down: (p: { context: QueryInterface }) => Promise<void>;
}

// Every migration, in order. Add a file NNN-name.ts and list it here (an explicit list works the same
// under tsx, vitest and the Next.js bundle, where a glob would not).
export const migrations: Migration[] = [
  { name: '001-foundation', ...m001 },
  { name: '002-forecasts', ...m002 },
  { name: '003-planning', ...m003 },
  { name: '004-logs-and-oil', ...m004 },
  { name: '005-alerts-mail', ...m005 },
  { name: '006-plan-unique', ...m006 },
  { name: '007-session-version', ...m007 },
  { name: '008-rate-limits', ...m008 },
  { name: '008-start-window', ...m008w },
  { name: '009-outcomes', ...m009 },
  { name: '010-devices', ...m010 },
  { name: '011-plan-chance', ...m011 },
];
