import type { Sequelize } from 'sequelize';
import { initDarkWindowCacheModel } from './dark-window-cache';
import { initFieldNoteModel } from './field-note';
import { initPhotoModel } from './photo';
import { initSightlineModel } from './sightline';
import { initTideEventModel } from './tide-event';
import { initUserModel } from './user';
import { initWatchModel } from './watch';
import { initWatchDeliveryModel } from './watch-delivery';
import { initOutboxMessageModel } from './outbox-message';
import { initCalendarFeedModel } from './calendar-feed';
import { initForecastCacheModel } from './forecast-cache';
import { initCrewMemberModel } from './crew-member';
import { initCrewInviteModel } from './crew-invite';
import { initOutingModel } from './outing';
import { initOutingResponseModel } from './outing-response';
import { initCameraBodyModel } from './camera-body';
import { initLensModel } from './lens';
import { initGearSettingsModel } from './gear-settings';

/** Registers every model and association on the instance; call once per Sequelize instance. */
export function initModels(sequelize: Sequelize) {
  const User = initUserModel(sequelize);
  const DarkWindowCache = initDarkWindowCacheModel(sequelize);
  const Sightline = initSightlineModel(sequelize);
  const FieldNote = initFieldNoteModel(sequelize);
  const TideEvent = initTideEventModel(sequelize);
  const Photo = initPhotoModel(sequelize);
  Sightline.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  FieldNote.belongsTo(User, { as: 'author', foreignKey: 'authorId' });
  FieldNote.belongsTo(Sightline, { foreignKey: 'sightlineId' });
  Sightline.hasMany(FieldNote, { foreignKey: 'sightlineId' });
  Sightline.hasMany(TideEvent, { foreignKey: 'sightlineId' });
  Sightline.hasMany(Photo, { foreignKey: 'sightlineId' });
  Photo.belongsTo(Sightline, { foreignKey: 'sightlineId' });
  const Watch = initWatchModel(sequelize);
  const WatchDelivery = initWatchDeliveryModel(sequelize);
  const OutboxMessage = initOutboxMessageModel(sequelize);
  const CalendarFeed = initCalendarFeedModel(sequelize);
  Watch.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Watch.belongsTo(Sightline, { as: 'sightline', foreignKey: 'sightlineId' });
  Watch.hasMany(WatchDelivery, { as: 'deliveries', foreignKey: 'watchId' });
  WatchDelivery.belongsTo(Watch, { as: 'watch', foreignKey: 'watchId' });
  CalendarFeed.belongsTo(User, { foreignKey: 'userId' });
  const ForecastCache = initForecastCacheModel(sequelize);
  const CrewMember = initCrewMemberModel(sequelize);
  const CrewInvite = initCrewInviteModel(sequelize);
  const Outing = initOutingModel(sequelize);
  const OutingResponse = initOutingResponseModel(sequelize);
  CrewMember.belongsTo(User, { as: 'user', foreignKey: 'userId' });
  CrewMember.belongsTo(Sightline, { foreignKey: 'sightlineId' });
  Sightline.hasMany(CrewMember, { as: 'crew', foreignKey: 'sightlineId' });
  CrewInvite.belongsTo(User, { as: 'inviter', foreignKey: 'invitedBy' });
  CrewInvite.belongsTo(Sightline, { foreignKey: 'sightlineId' });
  Outing.belongsTo(Sightline, { foreignKey: 'sightlineId' });
  Outing.hasMany(OutingResponse, { as: 'responses', foreignKey: 'outingId' });
  const CameraBody = initCameraBodyModel(sequelize);
  const Lens = initLensModel(sequelize);
  const GearSettings = initGearSettingsModel(sequelize);
  CameraBody.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  Lens.belongsTo(User, { as: 'owner', foreignKey: 'ownerId' });
  GearSettings.belongsTo(User, { foreignKey: 'userId' });
  return {
    User, DarkWindowCache, Sightline, FieldNote, TideEvent, Photo, Watch, WatchDelivery, OutboxMessage, CalendarFeed,
    ForecastCache, CrewMember, CrewInvite, Outing, OutingResponse, CameraBody, Lens, GearSettings,
  };
}

export type Models = ReturnType<typeof initModels>;
export { UserModel } from './user';
export { DarkWindowCacheModel } from './dark-window-cache';
export { SightlineModel } from './sightline';
export { FieldNoteModel } from './field-note';
export { TideEventModel } from './tide-event';
export { PhotoModel } from './photo';
export { WatchModel } from './watch';
export { WatchDeliveryModel } from './watch-delivery';
export { OutboxMessageModel } from './outbox-message';
export { CalendarFeedModel } from './calendar-feed';
export { ForecastCacheModel } from './forecast-cache';
export { CrewMemberModel } from './crew-member';
export { CrewInviteModel } from './crew-invite';
export { OutingModel } from './outing';
export { OutingResponseModel } from './outing-response';
export { CameraBodyModel } from './camera-body';
export { LensModel } from './lens';
export { GearSettingsModel } from './gear-settings';
