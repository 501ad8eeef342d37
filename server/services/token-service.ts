import { createSecretKey, type KeyObject } from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Role } from '../../shared/schemas/auth';

export interface SessionClaims {
  sub: string;
  role: Role;
}

/** Signs and checks the session tokens carried in the sign-in cookie. */
export class TokenService {
  // A key object made once: given a string, jsonwebtoken first tries (and fails) to read it as a
  // public key on every call, which was the largest cost of an authenticated request.
  private readonly key: KeyObject;

  constructor(
    secret: string,
    private readonly ttlHours: number,
  ) {
    this.key = createSecretKey(Buffer.from(secret, 'utf8'));
  }

  get ttlMs(): number {
    return this.ttlHours * 3600_000;
  }

  sign(claims: SessionClaims): string {
    return jwt.sign({ role: claims.role }, this.key, { subject: claims.sub, expiresIn: `${this.ttlHours}h`, algorithm: 'HS256' });
  }

  /** The claims of a valid token, or undefined for a missing, forged or expired one. */
  verify(token: string | undefined): SessionClaims | undefined {
    if (!token) return undefined;
    try {
      const payload = jwt.verify(token, this.key, { algorithms: ['HS256'] });
      if (typeof payload === 'string' || !payload.sub) return undefined;
      const role = payload.role === 'admin' ? 'admin' : 'member';
      return { sub: payload.sub, role };
    } catch {
      return undefined;
    }
  }
}
