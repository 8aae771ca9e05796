import { queryRoots } from '@/lib/query-keys';

export const authKeys = {
  all: queryRoots.auth,
  me: () => [...authKeys.all, 'me'] as const,
  invitation: (token: string) => [...authKeys.all, 'invitation', token] as const,
};
