import type { Role } from '@/shared/schemas/session';

export const roleLabels: Record<Role, string> = {
  member: 'Member',
  officer: 'Safety officer',
  manager: 'Lab manager',
};
