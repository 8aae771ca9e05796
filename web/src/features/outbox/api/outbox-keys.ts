import { queryRoots } from '@/lib/query-keys';

export const outboxKeys = {
  all: queryRoots.outbox,
  list: () => [...outboxKeys.all, 'list'] as const,
};
