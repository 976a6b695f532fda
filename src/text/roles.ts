import type { Role } from '@shared/schemas/auth';

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Account admin',
  consultant: 'Consultant',
  scientist: 'Scientist',
  client: 'Client (read only)',
};
