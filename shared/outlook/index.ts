/**
 * The sky outlook of lineup windows: forecast cells, the per-window summary (badge, dew risk,
 * horizon), dew point by the Magnus form, the watch's cloud condition, "changed a lot" rule and
 * send decision, the forecast's reach, hourly cloud bars, the outlook in words, and the caution
 * shown beside them. Pure: the forecast itself is fetched by the server.
 */
export { FORECAST_CELL_DEG, forecastCell, type ForecastCell } from './cell';
export {
  DEW_HUMIDITY_HIGH_PCT,
  DEW_HUMIDITY_MODERATE_PCT,
  DEW_SPREAD_HIGH_C,
  DEW_SPREAD_MODERATE_C,
  dewPointC,
  dewRiskOfHour,
  MAGNUS_A,
  MAGNUS_B_C,
  MAGNUS_E0_HPA,
  relativeHumidityFromDewPointPct,
  saturationVapourPressureHpa,
  worseDewRisk,
  type HourDewRisk,
} from './dew';
export {
  assertTimeWindows,
  CLEAR_MAX_HOUR_CLOUD_PCT,
  CLEAR_MAX_MEAN_CLOUD_PCT,
  CLOUDY_MIN_MEAN_CLOUD_PCT,
  cloudBadge,
  summarizeOutlook,
  summarizeOutlooks,
  unavailableOutlooks,
  type TimeWindow,
} from './summary';
export {
  cloudCondition,
  compareOutlooks,
  OUTLOOK_CHANGE_MEAN_CLOUD_PCT,
  OUTLOOK_CHANGE_WITH_BADGE_PCT,
  outlookChangedALot,
  watchOutlookDecision,
  type CloudConditionResult,
  type OutlookComparison,
  type WatchOutlookDecision,
  type WatchOutlookReason,
} from './watch';
export { FORECAST_HORIZON_DAYS, forecastReach, windowReach, type ForecastReach, type WindowReach } from './horizon';
export { cloudBars, type CloudBar } from './bars';
export { outlookFacts, outlookLabel, outlookSummary, type OutlookFact } from './text';
export { OUTLOOK_CAUTION } from './caution';
export {
  cloudBadges,
  dewRisks,
  forecastHourSchema,
  hourlyForecastSchema,
  outlookStatuses,
  skyOutlookSchema,
  type CloudBadge,
  type DewRisk,
  type ForecastHour,
  type ForecastOutlook,
  type HourlyForecast,
  type OutlookStatus,
  type SkyOutlook,
} from '../schemas/outlook';
