import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import { makeTestApp, type TestApp } from '../support/test-app';
import { backupDb } from '../../server/db/backup';
import { openDb } from '../../server/db/client';

let t: TestApp;
beforeAll(() => {
  t = makeTestApp();
});
afterAll(() => t.close());

describe('online backup (better-sqlite3 backup API)', () => {
  it('restores to a database with the same rows', async () => {
    const admin = await t.agentAs('admin');
    await admin.post('/api/users').send({ name: 'Kept Person', email: 'kept@test.trayce.local', role: 'sales', password: 'password-1' }).expect(201);
    const file = path.join(t.dataDir, 'backup-test.db');
    await backupDb(t.deps.db, file);
    const restored = openDb(file);
    const tables = ['users', 'stations', 'reason_codes', 'routing_templates', 'audit_log'];
    for (const table of tables) {
      const a = t.deps.db.all<{ n: number }>(sql.raw(`select count(*) n from ${table}`))[0].n;
      const b = restored.all<{ n: number }>(sql.raw(`select count(*) n from ${table}`))[0].n;
      expect(b, table).toBe(a);
    }
    const emails = restored.all<{ email: string }>(sql`select email from users order by email`).map((r) => r.email);
    expect(emails).toContain('kept@test.trayce.local');
    expect(restored.$client.pragma('integrity_check', { simple: true })).toBe('ok');
    restored.$client.close();
  });
});
