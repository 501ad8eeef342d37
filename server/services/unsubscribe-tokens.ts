import type { KeyObject } from 'node:crypto';
import { purposeKey } from './purpose-key';
import jwt from 'jsonwebtoken';

/** Purpose of the key: a session token can never pass as an unsubscribe token, nor the reverse. */
const PURPOSE = 'gnomon/watch-unsubscribe/v1';
const AUDIENCE = 'gnomon:watch-unsubscribe';
/** How long a link in an e-mail works. */
const TTL = '400d';
const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

export interface UnsubscribeClaims {
  deliveryId: string;
  watchId: string;
}

/** Why a token was refused, in words for the person who clicked the link. */
export class UnsubscribeTokenError extends Error {
  override name = 'UnsubscribeTokenError';
  constructor(readonly reason: 'invalid' | 'expired', message: string) {
    super(message);
  }
}

/**
 * Signs and checks the unsubscribe links in watch e-mails: a JWT (HS256) with its own audience,
 * signed with a key derived from the app's JWT secret by HMAC with a purpose string. One token
 * names one e-mail (its delivery) and the watch; it works without signing in.
 */
export class UnsubscribeTokens {
  private readonly key: KeyObject;

  constructor(jwtSecret: string) {
    this.key = purposeKey(jwtSecret, PURPOSE);
  }

  sign(claims: UnsubscribeClaims): string {
    return jwt.sign({ w: claims.watchId }, this.key, { subject: claims.deliveryId, audience: AUDIENCE, expiresIn: TTL, algorithm: 'HS256' });
  }

  /** The claims of a valid token; throws UnsubscribeTokenError for a forged, altered or expired one. */
  verify(token: string): UnsubscribeClaims {
    try {
      const payload = jwt.verify(token, this.key, { algorithms: ['HS256'], audience: AUDIENCE });
      if (typeof payload === 'string' || !UUID_RE.test(String(payload.sub)) || !UUID_RE.test(String(payload.w))) throw new Error('claims');
      return { deliveryId: String(payload.sub), watchId: String(payload.w) };
    } catch (error) {
      if (error instanceof jwt.TokenExpiredError) {
        throw new UnsubscribeTokenError('expired', 'This link has expired. Sign in and pause the watch from your watches page.');
      }
      throw new UnsubscribeTokenError('invalid', 'This unsubscribe link is not valid: it may have been altered or copied incompletely. Copy the whole link from the e-mail, or sign in and pause the watch from your watches page.');
    }
  }
}
