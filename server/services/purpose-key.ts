import { createHmac, createSecretKey, type KeyObject } from 'node:crypto';

/**
 * A signing key for one kind of link token, derived from the app's JWT secret by HMAC-SHA256 with
 * a purpose string: a token made for one purpose (a session, an unsubscribe link, an invite) never
 * verifies as another.
 */
export function purposeKey(jwtSecret: string, purpose: string): KeyObject {
  return createSecretKey(createHmac('sha256', jwtSecret).update(purpose).digest());
}
