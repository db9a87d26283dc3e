import { ROLES, type Role } from '@latchwork/shared-access';

/** The words people use for each role, as shown on screen. */
const LABELS: Readonly<Record<Role, string>> = {
  owner: 'Owner',
  estimator: 'Estimator',
  stores: 'Stores',
  bookkeeper: 'Bookkeeper',
  installer: 'Installer',
};

/** Every role with its label, in the role table's order (for role pickers). */
export const ROLE_OPTIONS: readonly { readonly value: Role; readonly label: string }[] = ROLES.map(
  (value) => ({ value, label: LABELS[value] }),
);

/** A role's label; an unknown role (newer API) is shown as it came. */
export function roleLabel(role: string): string {
  return (LABELS as Record<string, string>)[role] ?? role;
}
