import type { UserModel } from '../models/user';

declare global {
  namespace Express {
    interface Request {
      /** The signed-in account, set by the authenticate middleware. */
      user?: UserModel;
    }
  }
}

export {};
