import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { CapturedMail } from '../../../types/api';

/** Mails the local fake SMTP server caught; site admins only, or anyone in dev mode. */
export function getCapturedMails(signal?: AbortSignal): Promise<{ mails: CapturedMail[] }> {
  return api.get<{ mails: CapturedMail[] }>('/api/dev/mails', { signal });
}

export const capturedMailsQueryOptions = () =>
  queryOptions({ queryKey: ['dev', 'mails'], queryFn: ({ signal }) => getCapturedMails(signal), staleTime: 0 });

export function useCapturedMails() {
  return useQuery(capturedMailsQueryOptions());
}
