import { planBodySchema, progressBodySchema, resultBodySchema } from '../../shared/api/plans';
import * as plans from '../controllers/plans';
import { idParams } from './params';
import { defineRoute } from './route';

const onDraft = { resource: 'draft', params: idParams } as const;

// Progress and results are each weaver's own, so anyone who can see the draft may save theirs.
export const planRoutes = [
  defineRoute({ method: 'get', path: '/api/drafts/:id/plan', minimumRole: 'viewer', ...onDraft, handle: plans.getPlan }),
  defineRoute({ method: 'put', path: '/api/drafts/:id/plan', minimumRole: 'editor', ...onDraft, body: planBodySchema, handle: plans.savePlan }),
  defineRoute({ method: 'get', path: '/api/drafts/:id/progress', minimumRole: 'viewer', ...onDraft, handle: plans.getProgress }),
  defineRoute({
    method: 'put', path: '/api/drafts/:id/progress', minimumRole: 'viewer', ...onDraft, body: progressBodySchema, handle: plans.saveProgress,
  }),
  defineRoute({ method: 'get', path: '/api/drafts/:id/results', minimumRole: 'viewer', ...onDraft, handle: plans.listResults }),
  defineRoute({
    method: 'post', path: '/api/drafts/:id/results', minimumRole: 'viewer', ...onDraft, body: resultBodySchema, handle: plans.addResult,
  }),
  defineRoute({ method: 'get', path: '/api/me/plan-defaults', minimumRole: 'user', handle: plans.planDefaults }),
];
