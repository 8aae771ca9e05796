import { queryRoots } from '@/lib/query-keys';

export const userKeys = {
  all: queryRoots.users,
  lists: () => [...userKeys.all, 'list'] as const,
  invitations: () => [...userKeys.all, 'invitations'] as const,
};
