import { afterEach, describe, expect, it } from 'vitest';
import { env, resetEnvCache } from '@/lib/env';

// The database part of the environment: DATABASE_URL names PostgreSQL, the pool settings have working
// defaults and a bad value stops start-up naming the variable.
const saved = { ...process.env };
afterEach(() => {
  process.env = { ...saved };
  resetEnvCache();
});

function withEnv(vars: Record<string, string | undefined>) {
  process.env = { ...saved, ...vars };
  resetEnvCache();
  return env;
}

describe('database environment', () => {
  it('defaults: the SQLite file, a pool of 0–10 connections', () => {
    const e = withEnv({ DATABASE_URL: undefined, DB_POOL_MAX: undefined, DB_POOL_MIN: undefined, DB_POOL_IDLE_MS: undefined, DB_POOL_ACQUIRE_MS: undefined })();
    expect(e.DATABASE_URL).toBeUndefined();
    expect([e.DB_POOL_MIN, e.DB_POOL_MAX, e.DB_POOL_IDLE_MS, e.DB_POOL_ACQUIRE_MS]).toEqual([0, 10, 10_000, 60_000]);
  });

  it('takes postgres:// and postgresql:// URLs, and an empty value as unset', () => {
    expect(withEnv({ DATABASE_URL: 'postgres://u:p@db.example.test:5432/thawline' })().DATABASE_URL).toBe('postgres://u:p@db.example.test:5432/thawline');
    expect(withEnv({ DATABASE_URL: 'postgresql://u@localhost/t' })().DATABASE_URL).toBe('postgresql://u@localhost/t');
    expect(withEnv({ DATABASE_URL: '' })().DATABASE_URL).toBeUndefined();
  });

  it('refuses another scheme, a pool of one, and fewest above most, naming the variable', () => {
    expect(withEnv({ DATABASE_URL: 'mysql://u@localhost/t' })).toThrow(/DATABASE_URL/);
    expect(withEnv({ DB_POOL_MAX: '1' })).toThrow(/DB_POOL_MAX/);
    expect(withEnv({ DB_POOL_MAX: '4', DB_POOL_MIN: '5' })).toThrow(/DB_POOL_MIN/);
    expect(withEnv({ DB_POOL_ACQUIRE_MS: 'soon' })).toThrow(/DB_POOL_ACQUIRE_MS/);
  });
});
