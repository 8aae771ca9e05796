import { queryOptions, useQuery } from '@tanstack/react-query';
import { capturedMailSchema, type CapturedMail } from '@shuntwise/contracts';
import { apiRequest } from '@/lib/api-client';
import { outboxKeys } from './outbox-keys';

const mailsSchema = capturedMailSchema.array();

/** Mail the local SMTP fake captured, newest first (sorted here too, whatever order arrives). */
export async function getOutbox(signal?: AbortSignal): Promise<CapturedMail[]> {
  const mails = await apiRequest('/outbox', { schema: mailsSchema, signal });
  return [...mails].sort((a, b) => Date.parse(b.receivedAt) - Date.parse(a.receivedAt) || b.id - a.id);
}

export const outboxQueryOptions = () => queryOptions({ queryKey: outboxKeys.list(), queryFn: ({ signal }) => getOutbox(signal), staleTime: 0 });

export function useOutbox() {
  return useQuery(outboxQueryOptions());
}
