/** The roles a person can hold in a firm. One person may hold a different role in each firm. */
export const ROLES = ['owner', 'estimator', 'stores', 'bookkeeper', 'installer'] as const;
export type Role = (typeof ROLES)[number];

/**
 * What each role may do: the one table the API enforces and the web app reads to show only
 * what the role may use. Every API route names one of these permissions (or `public` /
 * `signed-in`); the route walker test fails on a route whose permission is not listed here.
 */
export const PERMISSIONS = {
  'settings:read': ['owner', 'estimator', 'stores', 'bookkeeper', 'installer'],
  'settings:write': ['owner'],
  'members:read': ['owner'],
  'members:write': ['owner'],
  'audit:read': ['owner'],
  'margins:read': ['owner'],
  'customers:read': ['owner', 'estimator', 'bookkeeper'],
  'customers:write': ['owner', 'estimator'],
  'jobs:read': ['owner', 'estimator', 'stores', 'bookkeeper', 'installer'],
  'jobs:write': ['owner', 'estimator'],
  'takeoffs:read': ['owner', 'estimator'],
  'takeoffs:write': ['owner', 'estimator'],
  'stock:read': ['owner', 'estimator', 'stores'],
  'stock:write': ['owner', 'stores'],
  // Posting a stock count whose variances exceed the firm's threshold.
  'stock:approve': ['owner'],
  'quotes:read': ['owner', 'estimator', 'bookkeeper'],
  'quotes:write': ['owner', 'estimator'],
  'invoices:read': ['owner', 'bookkeeper'],
  'invoices:write': ['owner', 'bookkeeper'],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

/** Route guards that are not permissions of a role: anyone, or anyone signed in. */
export type Access = Permission | 'public' | 'signed-in';

export function isPermission(name: string): name is Permission {
  return Object.prototype.hasOwnProperty.call(PERMISSIONS, name);
}

export function roleHas(role: Role, permission: Permission): boolean {
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** Every permission the role holds, for the web app to show or hide what it may use. */
export function permissionsOf(role: Role): Permission[] {
  return (Object.keys(PERMISSIONS) as Permission[]).filter((p) => roleHas(role, p));
}

export function isRole(name: string): name is Role {
  return (ROLES as readonly string[]).includes(name);
}
