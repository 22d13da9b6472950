import { createHash, randomBytes } from 'node:crypto';

/** An unguessable link token: 32 random bytes, base64url (43 characters). */
export const newToken = () => randomBytes(32).toString('base64url');

/** What is stored instead of a token, so a copy of the database opens no links. */
export const tokenHash = (token: string) => createHash('sha256').update(token).digest('hex');
