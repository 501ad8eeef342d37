import type { KeyObject } from 'node:crypto';
import { purposeKey } from './purpose-key';
import jwt from 'jsonwebtoken';

/** Purpose of the key: no other token of the app can pass as an invite token, nor the reverse. */
const PURPOSE = 'gnomon/crew-invite/v1';
const AUDIENCE = 'gnomon:crew-invite';
const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Why an invite token was refused, in words for the person who clicked the link. */
export class InviteTokenError extends Error {
  override name = 'InviteTokenError';
  constructor(readonly reason: 'invalid' | 'expired', message: string) {
    super(message);
  }
}

/**
 * Signs and checks crew invite links: a JWT (HS256) with its own audience, signed with a key
 * derived from the app's JWT secret by HMAC with a purpose string. The token names the invite row,
 * which says whether it is still open (single use: accepting closes it) and for which address.
 */
export class InviteTokens {
  private readonly key: KeyObject;

  constructor(jwtSecret: string) {
    this.key = purposeKey(jwtSecret, PURPOSE);
  }

  /** A token for the invite, expiring with it. */
  sign(inviteId: string, expiresAt: Date): string {
    return jwt.sign({ exp: Math.floor(expiresAt.getTime() / 1000) }, this.key, { subject: inviteId, audience: AUDIENCE, algorithm: 'HS256' });
  }

  /** The invite id of a valid token; throws InviteTokenError for a forged, altered or expired one. */
  verify(token: string, now: Date = new Date()): string {
    try {
      const payload = jwt.verify(token, this.key, { algorithms: ['HS256'], audience: AUDIENCE, clockTimestamp: Math.floor(now.getTime() / 1000) });
      if (typeof payload === 'string' || !UUID_RE.test(String(payload.sub))) throw new Error('claims');
      return String(payload.sub);
    } catch (error) {
      if (error instanceof jwt.TokenExpiredError) {
        throw new InviteTokenError('expired', 'This invite has expired. Ask the sightline\'s owner for a new one.');
      }
      throw new InviteTokenError('invalid', 'This invite link is not valid: it may have been altered or copied incompletely. Copy the whole link from the e-mail.');
    }
  }
}
