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

  /**
   * Changes role or disabled state; an admin cannot demote or disable their own account. The admin
   * rows are locked first, so two admins demoting each other at once cannot leave none: the second
   * finds that they are no longer an admin.
   */
  async update(actor: UserModel, id: string, change: UserUpdateRequest): Promise<UserModel> {
    if (id === actor.id && (change.role === 'member' || change.disabled === true)) {
      throw new AppError('validation', 'You cannot demote or disable your own account', { role: 'Ask another administrator' });
    }
    return UserModel.sequelize!.transaction(async (transaction) => {
      const admins = await UserModel.findAll({ where: { role: 'admin' }, transaction, lock: transaction.LOCK.UPDATE });
      const self = admins.find((a) => a.id === actor.id);
      if (!self || self.disabled) throw new AppError('forbidden', 'Only an active administrator can change accounts');
      const user = await UserModel.findByPk(id, { transaction, lock: transaction.LOCK.UPDATE });
      if (!user) throw AppError.notFound('No such account');
      if (change.role !== undefined) user.role = change.role;
      if (change.disabled !== undefined) user.disabled = change.disabled;
      await user.save({ transaction });
      return user;
    });
  }
}
