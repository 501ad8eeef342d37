import type { UserUpdateRequest } from '../../shared/schemas/auth';
import { AppError } from '../errors';
import { UserModel } from '../models/user';

/** Account administration. */
export class UserService {
  async list(): Promise<UserModel[]> {
    return UserModel.findAll({ order: [['createdAt', 'ASC']] });
  }

  async findActive(id: string): Promise<UserModel | null> {
    const user = await UserModel.findByPk(id);
    return user && !user.disabled ? user : null;
  }

  /** Changes role or disabled state; an admin cannot demote or disable their own account. */
  async update(actor: UserModel, id: string, change: UserUpdateRequest): Promise<UserModel> {
    const user = await UserModel.findByPk(id);
    if (!user) throw AppError.notFound('No such account');
    if (user.id === actor.id && (change.role === 'member' || change.disabled === true)) {
      throw new AppError('validation', 'You cannot demote or disable your own account', { role: 'Ask another administrator' });
    }
    if (change.role !== undefined) user.role = change.role;
    if (change.disabled !== undefined) user.disabled = change.disabled;
    await user.save();
    return user;
  }
}
