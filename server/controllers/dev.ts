import type { Ctx } from '../routes/route';

export async function mails({ app, res }: Ctx<unknown, unknown, unknown>) {
  res.json({ mails: await app.mails() });
}
