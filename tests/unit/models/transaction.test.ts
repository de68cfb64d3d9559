// writeTransaction(): busy and serialization errors are retried, others are not; nested calls join the
// outer transaction; simultaneous transactions on one SQLite file never fail with SQLITE_BUSY.
import os from 'node:os';
import path from 'node:path';
import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DataTypes, Sequelize } from 'sequelize';
import { guardWrites, isRetryableWriteError, writeTransaction } from '@/models/transaction';
import { describeError } from '@/lib/log';

let s: Sequelize;

beforeAll(async () => {
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'thawline-tx-'));
  // eslint-disable-next-line @typescript-eslint/no-require-imports
  s = new Sequelize({ dialect: 'sqlite', storage: path.join(dir, 'tx.sqlite'), dialectModule: require('sqlite3'), logging: false });
  guardWrites(s);
  s.define('Counter', { name: { type: DataTypes.STRING, primaryKey: true }, n: DataTypes.INTEGER }, { tableName: 'counters', timestamps: false });
  await s.sync();
  await s.models.Counter.create({ name: 'a', n: 0 });
});
afterAll(() => s.close());

const busy = () => Object.assign(new Error('SQLITE_BUSY: database is locked'), { name: 'SequelizeTimeoutError', parent: { code: 'SQLITE_BUSY' } });

describe('which errors are retried', () => {
  it('busy, locked, serialization failure and deadlock are; a unique violation only when asked; anything else never', () => {
    expect(isRetryableWriteError(busy())).toBe(true);
    expect(isRetryableWriteError({ parent: { code: 'SQLITE_LOCKED' } })).toBe(true);
    expect(isRetryableWriteError({ name: 'SequelizeDatabaseError', parent: { code: '40001' } })).toBe(true); // PostgreSQL serialization_failure
    expect(isRetryableWriteError({ name: 'SequelizeDatabaseError', parent: { code: '40P01' } })).toBe(true); // PostgreSQL deadlock_detected
    const unique = { name: 'SequelizeUniqueConstraintError', parent: { code: 'SQLITE_CONSTRAINT' } };
    expect(isRetryableWriteError(unique)).toBe(false);
    expect(isRetryableWriteError(unique, { retryOnUnique: true })).toBe(true);
    expect(isRetryableWriteError(new Error('boom'))).toBe(false);
    expect(isRetryableWriteError({ name: 'SequelizeDatabaseError', parent: { code: 'SQLITE_ERROR' } })).toBe(false);
  });
});

describe('writeTransaction', () => {
  it('retries the whole function on busy, and gives up after the bounded number of attempts', async () => {
    let calls = 0;
    const out = await writeTransaction(async () => {
      calls++;
      if (calls < 3) throw busy();
      return 'done';
    }, { sequelize: s });
    expect(out).toBe('done');
    expect(calls).toBe(3);
    calls = 0;
    await expect(
      writeTransaction(async () => {
        calls++;
        throw busy();
      }, { sequelize: s, attempts: 4 }),
    ).rejects.toThrow(/SQLITE_BUSY/);
    expect(calls).toBe(4);
  });

  it('does not retry an ordinary error, and rolls back what the function wrote', async () => {
    let calls = 0;
    await expect(
      writeTransaction(async (t) => {
        calls++;
        await s.models.Counter.update({ n: 99 }, { where: { name: 'a' }, transaction: t });
        throw new Error('not a database problem');
      }, { sequelize: s }),
    ).rejects.toThrow('not a database problem');
    expect(calls).toBe(1);
    expect((await s.models.Counter.findByPk('a'))!.get('n')).toBe(0);
  });

  it('a nested call joins the outer transaction; a query without its transaction inside runs in it', async () => {
    await writeTransaction(async (outer) => {
      await writeTransaction(async (inner) => {
        expect(inner).toBe(outer);
      }, { sequelize: s });
      // Without `transaction` this would wait on the lock the outer transaction holds.
      await s.models.Counter.update({ n: 5 }, { where: { name: 'a' } });
    }, { sequelize: s });
    expect((await s.models.Counter.findByPk('a'))!.get('n')).toBe(5);
  });

  it('100 simultaneous read-modify-write transactions and 100 single writes on one file: none fails, none is lost', async () => {
    await s.models.Counter.update({ n: 0 }, { where: { name: 'a' } });
    await s.models.Counter.create({ name: 'b', n: 0 });
    const tx = Array.from({ length: 100 }, () =>
      writeTransaction(async (t) => {
        const row = (await s.models.Counter.findByPk('a', { transaction: t }))!;
        await row.update({ n: (row.get('n') as number) + 1 }, { transaction: t });
      }, { sequelize: s }),
    );
    const single = Array.from({ length: 100 }, () => s.models.Counter.increment('n', { where: { name: 'b' } }));
    const results = await Promise.allSettled([...tx, ...single]);
    expect(results.filter((r) => r.status === 'rejected')).toEqual([]);
    expect((await s.models.Counter.findByPk('a'))!.get('n')).toBe(100);
    expect((await s.models.Counter.findByPk('b'))!.get('n')).toBe(100);
  });
});

describe('describeError', () => {
  it('names a database error by its name and code, without its message, SQL or values', () => {
    const err = Object.assign(new Error(`SQLITE_ERROR: near "secret-token": syntax error`), {
      name: 'SequelizeDatabaseError',
      sql: "INSERT INTO outbox_messages (text) VALUES ('https://x.test/reset/secret-token')",
      parent: { code: 'SQLITE_ERROR' },
    });
    expect(describeError(err)).toBe('SequelizeDatabaseError (SQLITE_ERROR)');
    expect(describeError(Object.assign(new Error('x'), { code: '23505' }))).toBe('Error (23505)');
    expect(describeError(new RangeError('planner: no feasible schedule'))).toBe('RangeError: planner: no feasible schedule');
    expect(describeError('a string')).toBe('string');
  });
});
