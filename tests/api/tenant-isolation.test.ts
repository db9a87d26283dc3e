import { sql } from 'kysely';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { withTenant } from '@latchwork/shared-db';
import { createTestApi } from './api-harness';
import { demoIds } from './sessions';

const { deps } = createTestApi();
afterAll(() => deps.close());

const TENANT_TABLES = ['audit_log', 'email_log', 'file', 'membership'];
let a = '';
let b = '';

beforeAll(async () => {
  const { tenant } = await demoIds(deps.db);
  a = tenant('kestrel-floorworks').id;
  b = tenant('pennick-flooring').id;
});

describe('row-level security, the second wall', () => {
  it('connects as a role that is neither superuser nor owner and cannot bypass RLS', async () => {
    const { rows } = await sql<{ rolsuper: boolean; rolbypassrls: boolean; owns: string }>`
      select r.rolsuper, r.rolbypassrls,
        (select count(*) from pg_tables where schemaname = 'public' and tableowner = current_user)::text as owns
      from pg_roles r where r.rolname = current_user`.execute(deps.db);
    expect(rows[0]).toEqual({ rolsuper: false, rolbypassrls: false, owns: '0' });
  });

  it('forces RLS on every table that carries tenant_id', async () => {
    const { rows } = await sql<{
      relname: string;
      relrowsecurity: boolean;
      relforcerowsecurity: boolean;
    }>`
      select c.relname, c.relrowsecurity, c.relforcerowsecurity from pg_class c
      join information_schema.columns col on col.table_name = c.relname and col.column_name = 'tenant_id' and col.table_schema = 'public'
      where c.relkind = 'r'`.execute(deps.db);
    expect(rows.map((r) => r.relname).sort()).toEqual(expect.arrayContaining(TENANT_TABLES));
    for (const r of rows)
      expect(r, r.relname).toMatchObject({ relrowsecurity: true, relforcerowsecurity: true });
  });

  it("returns only the request's firm's rows to a raw select * inside its transaction", async () => {
    for (const table of TENANT_TABLES) {
      const rowsA = await withTenant(deps.db, { tenantId: a }, (tx) =>
        sql<{ tenantId: string }>`select * from ${sql.table(table)}`.execute(tx),
      );
      expect(
        rowsA.rows.every((r) => r.tenantId === a),
        table,
      ).toBe(true);
    }
    const members = await withTenant(deps.db, { tenantId: a }, (tx) =>
      sql<{ tenantId: string }>`select * from membership`.execute(tx),
    );
    expect(members.rows.length).toBeGreaterThan(0);
    expect(members.rows.every((r) => r.tenantId === a)).toBe(true);
  });

  it('shows nothing when no firm is set', async () => {
    const { rows } = await deps.db
      .transaction()
      .execute((tx) => sql`select * from membership`.execute(tx));
    expect(rows).toEqual([]);
  });

  it("refuses an insert carrying another firm's id", async () => {
    const user = await deps.db
      .selectFrom('appUser')
      .select('id')
      .where('email', '=', 'crew@kestrel-floorworks.test')
      .executeTakeFirstOrThrow();
    await expect(
      withTenant(deps.db, { tenantId: a }, (tx) =>
        tx
          .insertInto('auditLog')
          .values({ tenantId: b, userId: user.id, action: 'forged' })
          .execute(),
      ),
    ).rejects.toThrow(/row-level security/);
  });

  it('does not let the application edit the audit log', async () => {
    await expect(
      withTenant(deps.db, { tenantId: a }, (tx) => sql`delete from audit_log`.execute(tx)),
    ).rejects.toThrow(/permission denied/);
  });
});
