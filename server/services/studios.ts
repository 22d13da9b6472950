import { fn, col } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import type { StudioDetailResponse, StudioListItem, StudioMember, Studio } from '../../shared/api/studios';
import { conflict, notFound } from '../http/errors';
import type { Models } from '../models';

/** The studios a user belongs to, with their role and how many members each has. */
export async function listStudios(models: Models, userId: number): Promise<StudioListItem[]> {
  const mine = await models.Membership.findAll({
    where: { userId },
    include: [{ model: models.Studio, as: 'studio' }],
    order: [[{ model: models.Studio, as: 'studio' }, 'name', 'ASC']],
  });
  if (mine.length === 0) return [];
  const counts = await models.Membership.findAll({
    attributes: ['studioId', [fn('COUNT', col('id')), 'count']],
    where: { studioId: mine.map((m) => m.studioId) },
    group: ['studioId'],
    raw: true,
  }) as unknown as { studioId: number; count: number | string }[];
  const countOf = new Map(counts.map((c) => [c.studioId, Number(c.count)]));
  return mine.map((m) => ({
    id: m.studioId,
    name: m.studio?.name ?? '',
    role: m.role,
    memberCount: countOf.get(m.studioId) ?? 0,
  }));
}

/** Creates a studio with its creator as the owner. */
export async function createStudio(models: Models, userId: number, name: string): Promise<Studio> {
  return models.Studio.sequelize!.transaction(async (transaction) => {
    const studio = await models.Studio.create({ name }, { transaction });
    await models.Membership.create({ studioId: studio.id, userId, role: 'owner' }, { transaction });
    return { id: studio.id, name: studio.name, role: 'owner' };
  });
}

/** The user's role in a studio, or null for a non-member. */
export async function studioRole(models: Models, userId: number, studioId: number): Promise<StudioRole | null> {
  return (await models.access.studioRoles(userId)).get(studioId) ?? null;
}

async function members(models: Models, studioId: number): Promise<StudioMember[]> {
  const rows = await models.Membership.findAll({
    where: { studioId },
    include: [{ model: models.User, as: 'user', attributes: ['id', 'name', 'email'] }],
    order: [[{ model: models.User, as: 'user' }, 'name', 'ASC']],
  });
  return rows.map((m) => ({ userId: m.userId, name: m.user?.name ?? '', email: m.user?.email ?? '', role: m.role }));
}

/** A studio and its members, for a member whose role the access check already found. */
export async function studioDetail(models: Models, studioId: number, role: StudioRole): Promise<StudioDetailResponse> {
  const studio = await models.Studio.findByPk(studioId);
  if (!studio) throw notFound('No such studio');
  return { studio: { id: studio.id, name: studio.name, role }, members: await members(models, studioId) };
}

async function ownerCount(models: Models, studioId: number): Promise<number> {
  return models.Membership.count({ where: { studioId, role: 'owner' } });
}

/** Changes a member's role (owners only); a studio always keeps at least one owner. */
export async function setMemberRole(
  models: Models, studioId: number, targetUserId: number, role: StudioRole,
): Promise<StudioMember[]> {
  const target = await models.Membership.findOne({ where: { studioId, userId: targetUserId } });
  if (!target) throw notFound('No such member');
  if (target.role === 'owner' && role !== 'owner' && (await ownerCount(models, studioId)) <= 1) {
    throw conflict('A studio needs at least one owner; make someone else owner first');
  }
  await target.update({ role });
  return members(models, studioId);
}

/**
 * Removes a member (the route lets owners remove anyone and any member leave); the last owner cannot go.
 */
export async function removeMember(models: Models, studioId: number, targetUserId: number): Promise<StudioMember[]> {
  const target = await models.Membership.findOne({ where: { studioId, userId: targetUserId } });
  if (!target) throw notFound('No such member');
  if (target.role === 'owner' && (await ownerCount(models, studioId)) <= 1) {
    throw conflict('A studio needs at least one owner; make someone else owner first');
  }
  await target.destroy();
  return members(models, studioId);
}
