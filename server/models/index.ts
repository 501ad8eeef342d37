import type { Sequelize } from 'sequelize';
import { initUserModel } from './user';

/** Registers every model on the instance; call once per Sequelize instance. */
export function initModels(sequelize: Sequelize) {
  const User = initUserModel(sequelize);
  return { User };
}

export type Models = ReturnType<typeof initModels>;
export { UserModel } from './user';
