/**
 * The caution the UI shows beside every sky outlook (badges, cloud bars, dew risk).
 */

/** Plain-text caution for the sky outlook, one short paragraph in English. */
export const OUTLOOK_CAUTION =
  'A cloud forecast is a model\'s estimate and changes from one run to the next, the more so the ' +
  'further ahead it looks. Check it again before you set out and watch the sky on the night. ' +
  'Clear nights are the coldest and often damp: dress for cold, carry a light, and tell someone ' +
  'where you are going. A lineup under a clear forecast is a plan, not a promise.';
