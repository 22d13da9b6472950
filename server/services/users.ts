import type { SessionUser } from '../../shared/api/auth';
import type { Models, UserRow } from '../models';

/** The signed-in user as the client sees it: no hash, plus studio memberships. */
export async function loadSessionUser(models: Models, userId: number): Promise<SessionUser | null> {
  const user = await models.User.findByPk(userId);
  if (!user) return null;
  return toSessionUser(models, user);
}

export async function toSessionUser(models: Models, user: UserRow): Promise<SessionUser> {
  const memberships = await models.Membership.findAll({
    where: { userId: user.id },
    include: [{ model: models.Studio, as: 'studio', attributes: ['name'] }],
    order: [['studioId', 'ASC']],
  });
  return {
    id: user.id,
    email: user.email,
    name: user.name,
    isAdmin: user.isAdmin,
    memberships: memberships.map((m) => ({
      studioId: m.studioId,
      studioName: m.studio?.name ?? '',
      role: m.role,
    })),
  };
}
