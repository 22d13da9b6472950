import type { Ctx } from '../http/handler';

export async function mails({ app, res }: Ctx<unknown, unknown, unknown>) {
  res.json({ mails: await app.mails() });
}
