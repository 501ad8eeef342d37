import type { Sequelize } from 'sequelize';
import type { UnsubscribeState } from '../../shared/schemas/watch';
import { AppError } from '../errors';
import { SightlineModel } from '../models/sightline';
import { targetRefName, WatchModel } from '../models/watch';
import { WatchDeliveryModel } from '../models/watch-delivery';
import { UnsubscribeTokenError, type UnsubscribeTokens } from './unsubscribe-tokens';

function stateOf(delivery: WatchDeliveryModel, watch: WatchModel): UnsubscribeState {
  return {
    watch: {
      id: watch.id,
      sightlineName: watch.sightline?.name ?? '',
      targetName: delivery.snapshot.target?.name ?? targetRefName(watch.target),
      paused: watch.paused,
    },
    used: delivery.unsubscribeUsedAt !== null,
    usedAt: delivery.unsubscribeUsedAt?.toISOString() ?? null,
  };
}

/**
 * The pause link in every watch e-mail: works without signing in, pauses the watch, and works
 * once (the e-mail's delivery row remembers that its link was used).
 */
export class UnsubscribeService {
  constructor(private readonly sequelize: Sequelize, private readonly tokens: UnsubscribeTokens) {}

  private claims(token: string) {
    try {
      return this.tokens.verify(token);
    } catch (error) {
      if (error instanceof UnsubscribeTokenError) throw new AppError('validation', error.message, { token: error.message });
      throw error;
    }
  }

  /** What the link would do: which watch, whether it is paused, whether this link was used. */
  async state(token: string): Promise<UnsubscribeState> {
    const { deliveryId, watchId } = this.claims(token);
    const delivery = await WatchDeliveryModel.findOne({ where: { id: deliveryId, watchId } });
    const watch = delivery && await WatchModel.findByPk(watchId, { include: [{ model: SightlineModel, as: 'sightline' }] });
    if (!delivery || !watch) throw AppError.notFound('This watch no longer exists: there is nothing to pause');
    return stateOf(delivery, watch);
  }

  /** Pauses the watch; a second use of the same link answers 409 and changes nothing. */
  async use(token: string): Promise<UnsubscribeState> {
    const { deliveryId, watchId } = this.claims(token);
    return this.sequelize.transaction(async (transaction) => {
      const delivery = await WatchDeliveryModel.findOne({ where: { id: deliveryId, watchId }, transaction, lock: transaction.LOCK.UPDATE });
      const watch = delivery && await WatchModel.findByPk(watchId, {
        include: [{ model: SightlineModel, as: 'sightline' }], transaction, lock: { level: transaction.LOCK.UPDATE, of: WatchModel },
      });
      if (!delivery || !watch) throw AppError.notFound('This watch no longer exists: there is nothing to pause');
      if (delivery.unsubscribeUsedAt) {
        throw new AppError('conflict', `This link was already used on ${delivery.unsubscribeUsedAt.toISOString().slice(0, 10)}. To change the watch, sign in and open your watches.`);
      }
      await delivery.update({ unsubscribeUsedAt: new Date() }, { transaction });
      if (!watch.paused) await watch.update({ paused: true }, { transaction });
      return stateOf(delivery, watch);
    });
  }
}
