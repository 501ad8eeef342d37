/**
 * The caution the UI shows beside every tide feature (tide rule, tide times, tide status).
 */

/** Plain-text caution for tide features, one short paragraph in English. */
export const TIDE_CAUTION =
  'Tide times are predictions: wind, air pressure and storm surge can make the water come in ' +
  'earlier and higher than the table says. Never let yourself be cut off below cliffs, on a ' +
  'stack or in a cave. Check the official tide table for the day and ask about local knowledge ' +
  'before you go, and leave a wide margin.';
