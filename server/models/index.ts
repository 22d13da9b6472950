import type { Sequelize } from 'sequelize';
import { defineDraft } from './draft';
import { defineDraftVersion } from './draft-version';
import { defineDraftPlan } from './draft-plan';
import { defineLoomProgress } from './loom-progress';
import { defineWeavingResult } from './weaving-result';
import { defineMembership } from './membership';
import { definePasswordReset } from './password-reset';
import { definePendingSignUp } from './pending-sign-up';
import { defineSession } from './session';
import { defineStudio } from './studio';
import { defineUser } from './user';
import { defineAttachment } from './attachment';
import { defineComment } from './comment';
import { defineInvitation } from './invitation';
import { defineShareLink } from './share-link';
import { defineYarn } from './yarn';
import { accessReads } from './access';

/**
 * Defines every model on one Sequelize instance and wires the associations in this one place.
 * Models are defined per instance (not as shared classes) so two app instances can coexist in tests.
 */
export function defineModels(sequelize: Sequelize) {
  const models = {
    User: defineUser(sequelize),
    Studio: defineStudio(sequelize),
    Membership: defineMembership(sequelize),
    Draft: defineDraft(sequelize),
    DraftVersion: defineDraftVersion(sequelize),
    PasswordReset: definePasswordReset(sequelize),
    PendingSignUp: definePendingSignUp(sequelize),
    Session: defineSession(sequelize),
    DraftPlan: defineDraftPlan(sequelize),
    LoomProgress: defineLoomProgress(sequelize),
    WeavingResult: defineWeavingResult(sequelize),
    Yarn: defineYarn(sequelize),
    Comment: defineComment(sequelize),
    ShareLink: defineShareLink(sequelize),
    Invitation: defineInvitation(sequelize),
    Attachment: defineAttachment(sequelize),
  };
  const { User, Studio, Membership, Draft, DraftVersion, PasswordReset } = models;

  Studio.hasMany(Membership, { foreignKey: 'studioId', as: 'memberships' });
  Membership.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });

  Draft.belongsTo(User, { foreignKey: 'ownerId', as: 'owner' });
  Draft.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });
  Draft.hasMany(DraftVersion, { foreignKey: 'draftId', as: 'versions' });
  DraftVersion.belongsTo(Draft, { foreignKey: 'draftId', as: 'draft' });
  DraftVersion.belongsTo(User, { foreignKey: 'authorId', as: 'author' });

  PasswordReset.belongsTo(User, { foreignKey: 'userId', as: 'user' });

  Draft.belongsTo(Draft, { foreignKey: 'parentDraftId', as: 'parent' });
  models.Comment.belongsTo(User, { foreignKey: 'authorId', as: 'author' });
  models.Attachment.belongsTo(User, { foreignKey: 'uploaderId', as: 'uploader' });
  models.Invitation.belongsTo(Studio, { foreignKey: 'studioId', as: 'studio' });

  models.DraftPlan.belongsTo(User, { foreignKey: 'updatedById', as: 'updatedBy' });
  models.WeavingResult.belongsTo(User, { foreignKey: 'userId', as: 'weaver' });
  return { ...models, access: accessReads(models) };
}

export type Models = ReturnType<typeof defineModels>;
export type { UserRow } from './user';
export type { StudioRow } from './studio';
export type { MembershipRow } from './membership';
export type { DraftRow } from './draft';
export type { DraftVersionRow } from './draft-version';
