import type { Me } from './session.store';

/** Test fixture: the `/me` answer for a demo person in one or two firms (used by specs only). */
export function meOf(role: string, permissions: string[], firms = 1): Me {
  const memberships = [
    { tenantId: 'firm-a', tenantName: 'Kestrel Floorworks Ltd', role },
    { tenantId: 'firm-b', tenantName: 'Pennick & Daughters Flooring', role: 'bookkeeper' },
  ].slice(0, firms);
  return {
    user: { id: 'user-1', email: 'someone@kestrel-floorworks.test', name: 'Ivy Marchetti' },
    memberships,
    activeTenant: {
      id: 'firm-a',
      name: 'Kestrel Floorworks Ltd',
      role,
      currency: 'GBP',
      units: 'metric',
    },
    permissions,
  };
}
