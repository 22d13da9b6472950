import type { Models } from '../../models';
import { createDraft } from '../../services/drafts';
import { hashPassword } from '../../services/passwords';
import { DEMO_STUDIO_NAME, demoAccounts } from '../demo-accounts';
import { forkDraft } from '../../services/draft-lifecycle';
import { colourAndWeaveSampler, doubleWeaveTableMat, pointTwillScarf, straightTwillTrial, TABLE_MAT_COLOURWAYS } from './demo-drafts';

/** True when no account exists yet, the one case in which the demo is added. */
export async function isEmpty(models: Models): Promise<boolean> {
  return (await models.User.count()) === 0;
}

/** Adds the demo studio, its people and drafts. */
export async function seedDemo(models: Models): Promise<void> {
  const ids = new Map<string, number>();
  for (const account of demoAccounts) {
    const user = await models.User.create({
      email: account.email,
      name: account.name,
      passwordHash: await hashPassword(account.password),
      isAdmin: account.role === 'admin',
    });
    ids.set(account.email, user.id);
  }
  const studio = await models.Studio.create({ name: DEMO_STUDIO_NAME });
  for (const account of demoAccounts) {
    if (account.role === 'admin') continue;
    await models.Membership.create({ studioId: studio.id, userId: ids.get(account.email)!, role: account.role });
  }
  const [lead, assistant, student] = demoAccounts.map((a) => ids.get(a.email)!);
  await createDraft(models, {
    ownerId: lead, studioId: studio.id, document: pointTwillScarf(), tags: ['twill', 'scarf', 'wool'],
  });
  await createDraft(models, {
    ownerId: assistant, studioId: studio.id, document: colourAndWeaveSampler(), tags: ['plain weave', 'colour and weave', 'sampler'],
  });
  const mat = await createDraft(models, {
    ownerId: lead, studioId: studio.id, document: doubleWeaveTableMat('harbour'), tags: ['double weave', 'table mat', 'blocks'],
  });
  // The second colourway is a fork of the first, as a weaver would make it, so the lineage shows.
  const meadow = TABLE_MAT_COLOURWAYS.meadow;
  await forkDraft(models, assistant, mat.id, { name: meadow.name, palette: [...meadow.palette], studioId: studio.id });
  await createDraft(models, { ownerId: student, studioId: null, document: straightTwillTrial(), tags: ['twill'] });
}
