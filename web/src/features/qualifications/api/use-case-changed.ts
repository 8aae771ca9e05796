import { useQueryClient } from '@tanstack/react-query';
import type { Qualification } from '@shuntwise/contracts';
import { invalidateKeys, staleAfter } from '@/lib/query-keys';
import { qualificationKeys } from './qualification-keys';

/**
 * After a change to a case: the answer is the case as it is now (stored as is), and the
 * lists and read models that show its state are stale (the Board, Compare, Sources and
 * catalogue keys, named in lib/query-keys since those features own them).
 */
export function useCaseChanged() {
  const queryClient = useQueryClient();
  return (changed: Qualification) => {
    queryClient.setQueryData(qualificationKeys.detail(changed.id), changed);
    return Promise.all([
      queryClient.invalidateQueries({ queryKey: qualificationKeys.lists() }),
      // A re-check changes the old case too (its link to the new one).
      changed.previousId !== null ? queryClient.invalidateQueries({ queryKey: qualificationKeys.detail(changed.previousId) }) : null,
      invalidateKeys(queryClient, staleAfter.caseChanged()),
    ]);
  };
}
