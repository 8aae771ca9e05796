import type { Role } from '@shuntwise/contracts';

/** The local demo accounts (invented people). All share DEMO_PASSWORD; for the local demo only. */
export const DEMO_USERS: ReadonlyArray<{ email: string; name: string; role: Role; note: string }> = [
  { email: 'admin@demo.test', name: 'Morgan Hale', role: 'admin', note: 'manages users and invitations' },
  { email: 'engineer@demo.test', name: 'Priya Raman', role: 'engineer', note: 'prepares qualifications' },
  { email: 'reviewer@demo.test', name: 'Tomas Eklund', role: 'engineer', note: 'a second engineer who signs off' },
  { email: 'designer@demo.test', name: 'Lena Okafor', role: 'designer', note: 'finds cleared parts, checks circuits' },
  { email: 'buyer@demo.test', name: 'Sam Delgado', role: 'buyer', note: 'reads and exports the source list' },
];
