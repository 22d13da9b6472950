import { useQuery, type UseQueryOptions } from '@tanstack/react-query';
import { useMemo, useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { MissingNotice } from '../../../components/ui/page-heading';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';
import { computePlan, planBlocker, type PlanOutputs } from '../../../../shared/plan/compute-plan';
import { planDocumentSchema, type PlanDocument } from '../../../../shared/plan/plan-schema';
import { parseDraft } from '../../../../shared/weave/draft';
import type { Draft } from '../../../../shared/weave/types';
import { usePlan } from '../api/get-plan';
import { usePlanDefaults } from '../api/get-plan-defaults';
import { useSavePlan } from '../api/save-plan';
import { percent } from '../format';
import { initialPlan, measuredChoice, mentionsWetWork } from '../plan-form';
import { PlanForm } from './plan-form';
import { PlanOutputsView } from './plan-outputs';

export type DraftQuery = UseQueryOptions<{ draft: DraftDetail }, Error, { draft: DraftDetail }, (string | number)[]>;

/** The Plan page of a draft: loads the draft and its saved plan, then the form and its results. */
export function PlanPage({ draftId, draftQuery }: { draftId: number; draftQuery: DraftQuery }) {
  const draft = useQuery(draftQuery);
  const plan = usePlan(draftId);
  if (draft.isPending || plan.isPending) return <Spinner label="Loading the plan…" />;
  const error = draft.error ?? plan.error;
  if (error) {
    if (isApiError(error, 404)) {
      return (
        <MissingNotice title="Draft not found" back={{ to: '/drafts', label: 'Back to Drafts' }}>
          This draft does not exist, or it is not shared with you.
        </MissingNotice>
      );
    }
    return <ErrorNotice title="Could not load the plan" error={error} onRetry={() => { void draft.refetch(); void plan.refetch(); }} />;
  }
  const detail = draft.data!.draft;
  return <PlanEditor detail={detail} saved={plan.data!.plan} />;
}

function fieldErrors(plan: PlanDocument): Record<string, string> {
  const r = planDocumentSchema.safeParse(plan);
  if (r.success) return {};
  const out: Record<string, string> = {};
  for (const issue of r.error.issues) out[issue.path.join('.')] ??= issue.message;
  return out;
}

function PlanEditor({ detail, saved }: { detail: DraftDetail; saved: PlanDocument | null }) {
  const draft = useMemo(() => parseDraft(detail.document), [detail.document]);
  const [plan, setPlan] = useState(() => initialPlan(saved, draft));
  const [dirty, setDirty] = useState(false);
  const save = useSavePlan(detail.id);
  const defaults = usePlanDefaults();
  const canSave = detail.role !== 'viewer';
  const { errors, outputs } = useMemo(() => {
    const errors = fieldErrors(plan);
    let outputs: PlanOutputs | string;
    const blocker = planBlocker(draft);
    if (blocker) outputs = blocker;
    else if (Object.keys(errors).length > 0) outputs = 'Some inputs need fixing before the plan can be worked out.';
    else {
      try {
        outputs = computePlan(draft, plan);
      } catch (e) {
        outputs = e instanceof Error ? e.message : 'This plan cannot be worked out.';
      }
    }
    return { errors, outputs };
  }, [draft, plan]);

  const change = (next: PlanDocument) => {
    setPlan(next);
    setDirty(true);
  };
  const choice = measuredChoice(defaults.data, plan);
  const measured = choice && {
    label: `Use my measured allowances (${choice.results} ${choice.results === 1 ? 'result' : 'results'}${choice.sameYarns ? ' with these yarns' : ''})`,
    apply: () => change({ ...plan, allowances: { ...plan.allowances, ...choice.allowances } }),
  };

  return (
    <div className="flex flex-col gap-6 py-4">
      <div className="flex flex-col gap-1">
        <h2 className="text-2xl font-semibold">Plan</h2>
        <p className="text-sm text-muted">
          Warp and weft for this draft. <Link to={`/drafts/${detail.id}/loom`}>At the loom</Link> follows this plan.
        </p>
      </div>

      <Cautions plan={plan} draft={draft} />

      <div className="grid gap-6 lg:grid-cols-2">
        <PlanForm plan={plan} draft={draft} onChange={change} errors={errors} measured={measured} />
        <div className="flex flex-col gap-4">
          <div className="flex flex-wrap items-center gap-3 rounded-md border border-line bg-surface p-3">
            {canSave ? (
              <Button
                variant="primary"
                className="min-h-11"
                busy={save.isPending}
                busyLabel="Saving…"
                disabled={Object.keys(errors).length > 0}
                onClick={() => save.mutate(planDocumentSchema.parse(plan), { onSuccess: () => setDirty(false) })}
              >
                Save plan
              </Button>
            ) : (
              <p className="text-sm">You can try numbers here; only editors of this draft can save its plan.</p>
            )}
            <p role="status" className="text-sm text-muted">
              {save.isSuccess && !dirty ? '✓ Saved.' : dirty ? 'Changes not saved yet.' : saved ? 'Saved plan.' : 'Not saved yet: common-practice starting values.'}
            </p>
            {save.isError && <ErrorNotice title="Could not save the plan" error={save.error} />}
          </div>
          {typeof outputs === 'string' ? (
            <p role="alert" className="rounded-md border border-danger bg-danger-soft p-3 text-sm">
              <span aria-hidden="true">⚠ </span>
              {outputs}
            </p>
          ) : (
            <PlanOutputsView outputs={outputs} plan={plan} draft={draft} />
          )}
          <p className="text-xs text-muted">
            Allowances in use: take-up {percent(plan.allowances.takeUp)}, draw-in {percent(plan.allowances.drawIn)}, shrinkage {percent(plan.allowances.lengthShrinkage)} in length and {percent(plan.allowances.widthShrinkage)} in width.
          </p>
        </div>
      </div>
    </div>
  );
}

function Cautions({ plan, draft }: { plan: PlanDocument; draft: Draft }) {
  return (
    <div className="flex flex-col gap-2">
      <p className="rounded-md border border-line bg-accent-soft p-3 text-sm">
        <strong>Estimates.</strong> These figures come from rules of thumb and your allowances. Weave and finish a sample
        first: the weaver&apos;s sample is the authority, and a little extra yarn is cheaper than running short.
      </p>
      {mentionsWetWork(plan.notes, draft.notes) && (
        <p role="note" className="rounded-md border border-danger bg-danger-soft p-3 text-sm">
          <span aria-hidden="true">⚠ </span>
          <strong>Dyes and finishing chemicals.</strong> Follow the maker&apos;s safety sheet: wear gloves, a dust mask for
          powders and eye protection; keep dye pots and tools out of the kitchen; work with fresh air; keep children and
          pets away; dispose of spent baths as the label and your local rules say.
        </p>
      )}
    </div>
  );
}
