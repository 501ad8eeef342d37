import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

/**
 * The JWT key for the embedded default: made once at random and kept in the data folder, so that
 * sessions survive a restart. Deployments pass JWT_SECRET instead.
 */
export function loadOrCreateJwtSecret(dataDir: string): string {
  const file = join(dataDir, 'jwt-secret');
  if (existsSync(file)) {
    const secret = readFileSync(file, 'utf8').trim();
    if (secret.length >= 32) return secret;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  writeFileSync(file, secret + '\n', { mode: 0o600 });
  return secret;
}
