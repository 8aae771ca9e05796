import { useContext, type ReactNode } from 'react';
import { QueryClientContext, QueryClientProvider } from '@tanstack/react-query';
import { queryClient } from '@/lib/query-client';

/**
 * Server state (TanStack Query) for the pages that have any. It is mounted by the
 * signed-in layout and the invitation page rather than at the root, so the sign-in
 * page does not download the query library (about 9 kB gzip of its 150 kB budget).
 * A client already in context (tests) is used as it is.
 */
export function QueryProvider({ children }: { children: ReactNode }) {
  const existing = useContext(QueryClientContext);
  if (existing) return <>{children}</>;
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
