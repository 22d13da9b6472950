import type { CommentBody } from '../../shared/api';
import type { Ctx } from '../http/handler';
import { addComment, deleteComment, listComments } from '../services/comments';

export async function list({ app, res, params }: Ctx<unknown, unknown, { id: number }>) {
  res.json({ comments: await listComments(app.models, params.id) });
}

export async function create({ app, req, res, params, body }: Ctx<CommentBody, unknown, { id: number }>) {
  res.status(201).json({ comment: await addComment(app.models, params.id, req.user!.id, body) });
}

export async function remove({ app, req, res, params }: Ctx<unknown, unknown, { id: number; commentId: number }>) {
  await deleteComment(app.models, params.id, params.commentId, req.user!.id);
  res.status(204).end();
}
