import { drawdownPngQuerySchema, printQuerySchema } from '../../shared/api/exports';
import { shareTokenParamsSchema } from '../../shared/api/sharing';
import * as exportsController from '../controllers/exports';
import { idParams } from './params';
import { defineRoute } from './route';

const draft = { resource: 'draft', params: idParams } as const;

/** Printed drafts and pictures of the cloth, for members and through a public link. */
export const exportRoutes = [
  defineRoute({ method: 'get', path: '/api/drafts/:id/print.pdf', minimumRole: 'viewer', ...draft, query: printQuerySchema, handle: exportsController.draftPdf }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/drawdown.png', minimumRole: 'viewer', ...draft, query: drawdownPngQuerySchema, handle: exportsController.draftPng,
  }),
  defineRoute({
    method: 'get', path: '/api/shared/:token/print.pdf', minimumRole: 'public', params: shareTokenParamsSchema, query: printQuerySchema,
    handle: exportsController.sharedPdf,
  }),
  defineRoute({
    method: 'get', path: '/api/shared/:token/drawdown.png', minimumRole: 'public', params: shareTokenParamsSchema, query: drawdownPngQuerySchema,
    handle: exportsController.sharedPng,
  }),
];
