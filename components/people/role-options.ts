import { roleLabels } from '@/components/common/roles';
import { ROLES, type Role } from '@/shared/schemas/session';

/** What each role may do, said where a manager picks one. */
export const ROLE_HINTS: Record<Role, string> = {
  member: 'Books gear, checks it out and returns it.',
  officer: 'Approves tests above the lab’s limits, keeps checklists, records qualifications.',
  manager: 'Registers gear, manages people, reads reports.',
};

export function roleOptions(testIdPrefix: string) {
  return ROLES.map((role) => ({ value: role, label: roleLabels[role], testID: `${testIdPrefix}-${role}` }));
}

export const NO_GROUP = 'none';

/** Group choices as strings (the control's values), with "No group" first. */
export function groupOptions(groups: readonly { id: number; name: string }[], testIdPrefix: string) {
  return [
    { value: NO_GROUP, label: 'No group', testID: `${testIdPrefix}-${NO_GROUP}` },
    ...groups.map((g) => ({ value: String(g.id), label: g.name, testID: `${testIdPrefix}-${g.id}` })),
  ];
}

export function groupIdFromOption(value: string): number | null {
  return value === NO_GROUP ? null : Number(value);
}
