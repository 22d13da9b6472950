import type { Comment, CommentBody } from '../../shared/api';
import { forbidden, HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { CommentRow } from '../models/comment';

function toComment(row: CommentRow): Comment {
  return {
    id: row.id,
    authorId: row.authorId,
    authorName: row.author?.name ?? '',
    text: row.text,
    version: row.version,
    end: row.endNumber,
    pick: row.pickNumber,
    createdAt: row.createdAt.toISOString(),
  };
}

/** A draft's comments, oldest first, as a conversation reads. */
export async function listComments(models: Models, draftId: number): Promise<Comment[]> {
  const rows = await models.Comment.findAll({
    where: { draftId },
    include: [{ model: models.User, as: 'author', attributes: ['name'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  return rows.map(toComment);
}

/** Adds a comment; a version it names must exist. */
export async function addComment(models: Models, draftId: number, authorId: number, body: CommentBody): Promise<Comment> {
  if (body.version !== undefined) {
    const exists = await models.DraftVersion.count({ where: { draftId, version: body.version } });
    if (!exists) throw new HttpError(422, 'unprocessable', `This draft has no version ${body.version}`, { version: 'no such version' });
  }
  const row = await models.Comment.create({
    draftId, authorId, text: body.text, version: body.version ?? null, endNumber: body.end ?? null, pickNumber: body.pick ?? null,
  });
  const author = await models.User.findByPk(authorId, { attributes: ['name'] });
  return { ...toComment(row), authorName: author?.name ?? '' };
}

/** Deletes a comment: its author only. */
export async function deleteComment(models: Models, draftId: number, commentId: number, userId: number): Promise<void> {
  const row = await models.Comment.findOne({ where: { id: commentId, draftId } });
  if (!row) throw notFound('No such comment');
  if (row.authorId !== userId) throw forbidden('Only its author can delete a comment');
  await row.destroy();
}
