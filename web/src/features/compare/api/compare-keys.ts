import { queryRoots, sharedKeys } from '@/lib/query-keys';

export const compareKeys = {
  all: queryRoots.compare,
  housePart: sharedKeys.compare,
};
