import type { StudioRole } from '../../shared/api/auth';
import type { DraftModel } from './draft';
import type { MembershipModel } from './membership';
import type { UserModel } from './user';

/** The account fields a request needs, as read for the signed-in user. */
export interface AccountFields {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
}

/** The account fields of a user row; Boolean() because a plain row carries the column's 0 or 1. */
export const accountOf = (row: Pick<AccountFields, 'id' | 'email' | 'name'> & { isAdmin: unknown }): AccountFields =>
  ({ id: row.id, email: row.email, name: row.name, isAdmin: Boolean(row.isAdmin) });

/** Whose a draft is: enough to work out anyone's role on it. */
export interface DraftOwnership {
  ownerId: number;
  studioId: number | null;
  /** When it was put in the Bin, or null. */
  binnedAt: Date | null;
}

/**
 * What access checks read: the signed-in account, the user's studio roles, a draft's owner and
 * studio. Always read from MariaDB, never kept between requests, so every server sees another's
 * writes at once (a removed member is refused at their next request, whichever server answers).
 */
export interface AccessReads {
  account(userId: number): Promise<AccountFields | null>;
  /** studioId → role for every studio the user belongs to. */
  studioRoles(userId: number): Promise<ReadonlyMap<number, StudioRole>>;
  draftOwnership(draftId: number): Promise<DraftOwnership | null>;
}

export function accessReads(models: { User: UserModel; Membership: MembershipModel; Draft: DraftModel }): AccessReads {
  return {
    async account(userId) {
      const row = await models.User.findByPk(userId, { attributes: ['id', 'email', 'name', 'isAdmin'], raw: true });
      return row ? accountOf(row) : null;
    },
    async studioRoles(userId) {
      const rows = await models.Membership.findAll({ where: { userId }, attributes: ['studioId', 'role'], raw: true });
      return new Map(rows.map((r) => [r.studioId, r.role]));
    },
    async draftOwnership(draftId) {
      const row = await models.Draft.findByPk(draftId, { attributes: ['ownerId', 'studioId', 'binnedAt'], raw: true });
      return row ? { ownerId: row.ownerId, studioId: row.studioId, binnedAt: row.binnedAt ? new Date(row.binnedAt) : null } : null;
    },
  };
}
