import type { Role } from '../../shared/schemas/roles.js';

/** The invented demo team; the README lists these passwords as demo-only. */
export const DEMO_TEAM_NAME = 'Quillmoor Electric Racing (demo)';

export const DEMO_USERS: readonly { email: string; displayName: string; role: Role; password: string }[] = [
  { email: 'admin@example.test', displayName: 'Odile Brackwater', role: 'admin', password: 'tallyvolt-admin' },
  { email: 'designer@example.test', displayName: 'Tamsin Fenwright', role: 'designer', password: 'tallyvolt-designer' },
  { email: 'tester@example.test', displayName: 'Ivo Kestrand', role: 'tester', password: 'tallyvolt-tester' },
  { email: 'lead@example.test', displayName: 'Maren Holtcroft', role: 'lead', password: 'tallyvolt-lead' },
];
