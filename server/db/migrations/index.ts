import type { QueryInterface } from 'sequelize';
import type { RunnableMigration } from 'umzug';
import * as initial from './0001-initial';
import * as plansAndProgress from './0002-plans-and-progress';
import * as draftsService from './0003-drafts-service';
import * as listIndexes from './0004-list-indexes';
import * as structureBackfill from './0005-structure-backfill';
import * as saveProcedure from './0006-save-procedure';
import * as workingVersions from './0007-working-versions';
import * as pendingSignUps from './0008-pending-sign-ups';
import * as rateLimits from './0009-rate-limits';
import * as draftBin from './0010-draft-bin';

/**
 * Every migration, oldest first. Listed by hand rather than globbed so the list is type-checked and
 * works the same under tsx, vitest and a bundler. Add a new file and a line here; never edit an old one.
 */
export const migrations: RunnableMigration<QueryInterface>[] = [
  { name: '0001-initial', ...initial },
  { name: '0002-plans-and-progress', ...plansAndProgress },
  { name: '0003-drafts-service', ...draftsService },
  { name: '0004-list-indexes', ...listIndexes },
  { name: '0005-structure-backfill', ...structureBackfill },
  { name: '0006-save-procedure', ...saveProcedure },
  { name: '0007-working-versions', ...workingVersions },
  { name: '0008-pending-sign-ups', ...pendingSignUps },
  { name: '0009-rate-limits', ...rateLimits },
  { name: '0010-draft-bin', ...draftBin },
];
