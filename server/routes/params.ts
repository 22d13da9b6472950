import { z } from 'zod';

const id = z.coerce.number().int().positive().max(2 ** 31 - 1);

export const idParams = z.object({ id });
export const memberParams = z.object({ id, userId: id });
