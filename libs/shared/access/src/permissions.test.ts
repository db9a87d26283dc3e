import { describe, expect, it } from 'vitest';
import { PERMISSIONS, ROLES, permissionsOf, roleHas } from './permissions';

describe('the permission table', () => {
  it('lets the owner do everything', () => {
    expect(permissionsOf('owner')).toEqual(Object.keys(PERMISSIONS));
  });

  it('keeps margins, members, settings changes and the audit log with the owner only', () => {
    for (const p of ['margins:read', 'members:write', 'settings:write', 'audit:read'] as const) {
      expect(ROLES.filter((r) => roleHas(r, p))).toEqual(['owner']);
    }
  });

  it('gives an installer job sheets but no money or stock', () => {
    expect(permissionsOf('installer')).toEqual(['settings:read', 'jobs:read']);
  });

  it('names only known roles', () => {
    for (const roles of Object.values(PERMISSIONS))
      for (const r of roles) expect(ROLES).toContain(r);
  });
});
