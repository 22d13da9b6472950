import { z } from 'zod';
import {
  compareQuerySchema, createDraftBodySchema, draftListQuerySchema, forkBodySchema, importWifFieldsSchema, saveDraftBodySchema,
  updateDraftBodySchema, versionParamsSchema, versionQuerySchema, WIF_MAX_BYTES,
} from '../../shared/api';
import * as drafts from '../controllers/drafts';
import * as history from '../controllers/history';
import { singleFileUpload } from '../middleware/upload';
import { idParams } from './params';
import { defineRoute } from './route';

const draft = { resource: 'draft', params: idParams } as const;
const thumbnailQuery = z.object({ v: z.coerce.number().int().nonnegative().optional() });

export const draftRoutes = [
  defineRoute({ method: 'get', path: '/api/drafts', minimumRole: 'user', query: draftListQuerySchema, handle: drafts.list }),
  defineRoute({ method: 'post', path: '/api/drafts', minimumRole: 'user', body: createDraftBodySchema, handle: drafts.create }),
  defineRoute({
    method: 'post', path: '/api/drafts/import-wif', minimumRole: 'user', upload: singleFileUpload(WIF_MAX_BYTES),
    body: importWifFieldsSchema, handle: drafts.importWif,
  }),
  defineRoute({ method: 'get', path: '/api/drafts/:id', minimumRole: 'viewer', ...draft, handle: drafts.detail }),
  defineRoute({ method: 'put', path: '/api/drafts/:id', minimumRole: 'editor', ...draft, body: saveDraftBodySchema, handle: drafts.save }),
  defineRoute({ method: 'patch', path: '/api/drafts/:id', minimumRole: 'editor', ...draft, body: updateDraftBodySchema, handle: drafts.update }),
  // Delete puts the draft in the Bin; its owner restores it from there within BIN_DAYS.
  defineRoute({ method: 'delete', path: '/api/drafts/:id', minimumRole: 'owner', ...draft, handle: drafts.remove }),
  defineRoute({ method: 'get', path: '/api/bin', minimumRole: 'user', handle: drafts.bin }),
  defineRoute({ method: 'post', path: '/api/drafts/:id/restore', minimumRole: 'owner', ...draft, inBin: true, handle: drafts.restore }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/thumbnail.png', minimumRole: 'viewer', ...draft, query: thumbnailQuery, handle: drafts.thumbnail,
  }),
  defineRoute({ method: 'get', path: '/api/drafts/:id/versions', minimumRole: 'viewer', ...draft, handle: history.versions }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/versions/:n', minimumRole: 'viewer', resource: 'draft', params: versionParamsSchema, handle: history.version,
  }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/versions/:n/thumbnail.png', minimumRole: 'viewer', resource: 'draft', params: versionParamsSchema,
    handle: history.thumbnail,
  }),
  defineRoute({
    method: 'post', path: '/api/drafts/:id/versions/:n/restore', minimumRole: 'editor', resource: 'draft', params: versionParamsSchema,
    handle: history.restore,
  }),
  defineRoute({ method: 'get', path: '/api/drafts/:id/compare', minimumRole: 'viewer', ...draft, query: compareQuerySchema, handle: history.compare }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/compare.png', minimumRole: 'viewer', ...draft, query: compareQuerySchema, handle: history.compareImage,
  }),
  // Viewers may fork: a student makes a studio draft their own in their own space.
  defineRoute({ method: 'post', path: '/api/drafts/:id/fork', minimumRole: 'viewer', ...draft, body: forkBodySchema, handle: drafts.fork }),
  defineRoute({ method: 'get', path: '/api/drafts/:id/lineage', minimumRole: 'viewer', ...draft, handle: drafts.draftLineage }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/export.wif', minimumRole: 'viewer', ...draft, query: versionQuerySchema, handle: drafts.exportWif,
  }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/export.json', minimumRole: 'viewer', ...draft, query: versionQuerySchema, handle: drafts.exportJson,
  }),
];
