import bcrypt from 'bcryptjs';
import { UniqueConstraintError } from 'sequelize';
import type { LoginRequest, RegisterRequest } from '../../shared/schemas/auth';
import { AppError } from '../errors';
import { UserModel } from '../models/user';

const WRONG_CREDENTIALS = 'E-mail or password is not right';

/** Creating accounts and checking credentials. */
export class AuthService {
  // A hash to compare against when the e-mail is unknown, so both failures take the same time.
  private readonly dummyHash: string;

  constructor(private readonly bcryptRounds: number) {
    this.dummyHash = bcrypt.hashSync('not-a-real-password', bcryptRounds);
  }

  hashPassword(password: string): Promise<string> {
    return bcrypt.hash(password, this.bcryptRounds);
  }

  async register(input: RegisterRequest): Promise<UserModel> {
    const passwordHash = await this.hashPassword(input.password);
    try {
      return await UserModel.create({ name: input.name, email: input.email, passwordHash, role: 'member' });
    } catch (error) {
      if (error instanceof UniqueConstraintError) {
        throw new AppError('conflict', 'An account with this e-mail already exists', { email: 'An account with this e-mail already exists' });
      }
      throw error;
    }
  }

  /** The account for these credentials; one generic 401 for an unknown e-mail or a wrong password. */
  async login(input: LoginRequest): Promise<UserModel> {
    const user = await UserModel.findOne({ where: { email: input.email } });
    const ok = await bcrypt.compare(input.password, user?.passwordHash ?? this.dummyHash);
    if (!user || !ok) throw new AppError('unauthenticated', WRONG_CREDENTIALS);
    if (user.disabled) throw new AppError('forbidden', 'This account has been disabled. Ask an administrator.');
    return user;
  }
}
