/**
 * Chart geometry for the night chart, its alt-az panel and the year view: pure functions from
 * shared/sky positions to sampled series, scales, SVG path data and calendar cells.
 */
export { linearScale, linearTicks, niceStep, piecewiseLinearScale, type LinearScale } from './scale';
export { bandRuns, intersectRuns, type MsInterval } from './intervals';
export { localClock, localHourTicks, nightDateOf, NIGHT_STARTS_AT_LOCAL_HOUR, zoneLabelAt, type HourTick } from './localTime';
export { skyBrightness, sunLimitCrossings, TWILIGHT_LIMITS_DEG, twilightSegments, type SkyBrightness, type SunLimitCrossing, type TwilightSegment } from './twilight';
export {
  DEFAULT_NIGHT_CHART_MARGIN_MIN,
  DEFAULT_NIGHT_CHART_STEP_MIN,
  MIDNIGHT_SUN_HALF_SPAN_H,
  nightChartSeries,
  type NightChartInput,
  type NightChartSeries,
} from './nightSeries';
export { altAzView, azimuthOffsetDeg, DEFAULT_ALT_AZ_HALF_SPAN_DEG, landmarkSilhouette, type AltAzPoint, type AltAzView } from './altAz';
export { polylinePath, seriesPath, type ChartPoint } from './paths';
export {
  bestScoresByNight,
  MAX_YEAR_VIEW_MONTHS,
  monthsOfNights,
  nightsWithDarkness,
  parseMonth,
  yearHeatmap,
  yearViewRange,
  type YearHeatmapInput,
  type YearMonth,
  type YearNight,
} from './yearGrid';
