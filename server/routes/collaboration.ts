import {
  acceptInviteBodySchema, commentBodySchema, commentParamsSchema, inviteBodySchema, PHOTO_MAX_BYTES, photoParamsSchema,
  shareTokenParamsSchema, versionParamsSchema,
} from '../../shared/api';
import * as comments from '../controllers/comments';
import * as photos from '../controllers/photos';
import * as sharing from '../controllers/sharing';
import { singleFileUpload } from '../middleware/upload';
import { idParams } from './params';
import { defineRoute } from './route';

const draft = { resource: 'draft', params: idParams } as const;

/** Sharing a draft with people: public links, studio invitations, comments and photos of the cloth. */
export const collaborationRoutes = [
  defineRoute({ method: 'get', path: '/api/drafts/:id/share', minimumRole: 'editor', ...draft, handle: sharing.status }),
  defineRoute({ method: 'post', path: '/api/drafts/:id/share', minimumRole: 'editor', ...draft, handle: sharing.share }),
  defineRoute({ method: 'delete', path: '/api/drafts/:id/share', minimumRole: 'editor', ...draft, handle: sharing.revoke }),
  defineRoute({ method: 'get', path: '/api/shared/:token', minimumRole: 'public', params: shareTokenParamsSchema, handle: sharing.shared }),

  defineRoute({
    method: 'post', path: '/api/studios/:id/invitations', minimumRole: 'owner', resource: 'studio', params: idParams, body: inviteBodySchema,
    handle: sharing.invite,
  }),
  defineRoute({ method: 'post', path: '/api/invitations/accept', minimumRole: 'user', body: acceptInviteBodySchema, handle: sharing.accept }),

  defineRoute({ method: 'get', path: '/api/drafts/:id/comments', minimumRole: 'viewer', ...draft, handle: comments.list }),
  defineRoute({ method: 'post', path: '/api/drafts/:id/comments', minimumRole: 'viewer', ...draft, body: commentBodySchema, handle: comments.create }),
  defineRoute({
    method: 'delete', path: '/api/drafts/:id/comments/:commentId', minimumRole: 'viewer', resource: 'draft', params: commentParamsSchema,
    handle: comments.remove,
  }),

  defineRoute({ method: 'get', path: '/api/drafts/:id/photos', minimumRole: 'viewer', ...draft, handle: photos.list }),
  defineRoute({
    method: 'post', path: '/api/drafts/:id/versions/:n/photos', minimumRole: 'editor', resource: 'draft', params: versionParamsSchema,
    upload: singleFileUpload(PHOTO_MAX_BYTES), handle: photos.upload,
  }),
  defineRoute({
    method: 'get', path: '/api/drafts/:id/photos/:photoId', minimumRole: 'viewer', resource: 'draft', params: photoParamsSchema, handle: photos.bytes,
  }),
];
