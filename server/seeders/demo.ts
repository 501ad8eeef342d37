/**
 * The demo scenario: invented people. Seeding is idempotent: it creates what is missing and never
 * touches an account outside this list.
 */
import type { Role } from '../../shared/schemas/auth';
import { UserModel } from '../models/user';
import type { AuthService } from '../services/auth-service';

export const DEMO_PASSWORD = 'nightfall-demo';

export const demoAccounts: ReadonlyArray<{ name: string; email: string; role: Role }> = [
  { name: 'Ines Marlowe', email: 'ines@demo.gnomon.test', role: 'admin' },
  { name: 'Tomas Quill', email: 'tomas@demo.gnomon.test', role: 'member' },
  { name: 'Priya Ventner', email: 'priya@demo.gnomon.test', role: 'member' },
];

/** Creates the demo accounts that do not exist yet; returns how many were created. */
export async function seedDemo(auth: AuthService): Promise<number> {
  let created = 0;
  for (const account of demoAccounts) {
    const existing = await UserModel.findOne({ where: { email: account.email } });
    if (existing) continue;
    await UserModel.create({ ...account, passwordHash: await auth.hashPassword(DEMO_PASSWORD) });
    created += 1;
  }
  return created;
}
