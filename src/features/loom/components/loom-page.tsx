import { SECTION_NAMES } from '../../../../shared/words';
import { useQuery, type UseQueryOptions } from '@tanstack/react-query';
import { useEffect } from 'react';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { MissingNotice } from '../../../components/ui/page-heading';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';
import type { PlanResponse } from '../../../../shared/api/plans';
import { progressQueryOptions } from '../api/get-progress';
import { readLoomCache, writeLoomCache } from '../offline-store';
import { LoomGuide } from './loom-guide';

export type DraftQuery = UseQueryOptions<{ draft: DraftDetail }, Error, { draft: DraftDetail }, (string | number)[]>;
export type PlanQuery = UseQueryOptions<PlanResponse, Error, PlanResponse, (string | number)[]>;

/**
 * The At-the-loom page. The draft and plan are kept on the device each time they load, so when
 * the connection fails the page carries on from that copy.
 */
export function LoomPage({ draftId, draftQuery, planQuery }: { draftId: number; draftQuery: DraftQuery; planQuery: PlanQuery }) {
  const draft = useQuery(draftQuery);
  const plan = useQuery(planQuery);
  const progress = useQuery(progressQueryOptions(draftId));
  const cache = readLoomCache(draftId);

  useEffect(() => {
    if (draft.data) {
      const { id, name, document, role } = draft.data.draft;
      writeLoomCache(draftId, { draft: { id, name, document, role } });
    }
  }, [draft.data, draftId]);
  useEffect(() => {
    if (plan.data) writeLoomCache(draftId, { plan: plan.data.plan });
  }, [plan.data, draftId]);

  const offline = (q: { error: Error | null }) => isApiError(q.error, 0);
  const detail = draft.data?.draft ?? (offline(draft) ? cache.draft : undefined);
  const planDoc = plan.data ? plan.data.plan : offline(plan) ? cache.plan : undefined;

  if (isApiError(draft.error, 404) || isApiError(plan.error, 404)) {
    return (
      <MissingNotice title="Draft not found" back={{ to: '/drafts', label: 'Back to Drafts' }}>
        This draft does not exist, or it is not shared with you.
      </MissingNotice>
    );
  }
  const failed = (!detail && draft.error) || (planDoc === undefined && plan.error);
  if (failed) return <ErrorNotice title={`Could not open ${SECTION_NAMES.loom}`} error={failed} onRetry={() => { void draft.refetch(); void plan.refetch(); }} />;
  if (!detail || planDoc === undefined) return <Spinner label={`Loading ${SECTION_NAMES.loom}…`} />;
  // Offline on arrival: go on from the place kept on this device.
  const serverPlace = progress.data ? progress.data.progress : progress.isError ? null : undefined;
  return <LoomGuide detail={detail} savedPlan={planDoc} serverPlace={serverPlace} offline={offline(draft)} />;
}
