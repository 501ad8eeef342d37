/**
 * Types for magvar 2.2.0 (CommonJS, ships no declarations): only the parts Gnomon uses, written
 * from node_modules/magvar/src/magvar.js.
 */
declare module 'magvar' {
  /** Geomagnetic field from WMM2025. Angles in degrees rounded to 0.01, intensities in nT rounded to 0.1. */
  export interface MagvarField {
    /** D, degrees, east positive. */
    declination: number;
    /** I, degrees, down positive. */
    inclination: number;
    /** North component X, nT. */
    x: number;
    /** East component Y, nT. */
    y: number;
    /** Down component Z, nT. */
    z: number;
    /** Horizontal intensity H, nT. */
    h: number;
    /** Total intensity F, nT. */
    f: number;
    /** Decimal year the field was computed for. */
    decimalYear: number;
  }
  /**
   * Field at a geodetic latitude/longitude (degrees), a height in kilometres, and a time given as a
   * decimal year or a Date (converted in UTC); `when` omitted means now. Outside 2025.0-2030.0 it
   * still answers, and prints one console.warn per process.
   */
  export function magneticField(latitude: number, longitude: number, altitudeKm?: number, when?: number | Date): MagvarField;
  /** First decimal year of the model (2025.0). */
  export const MODEL_EPOCH: number;
  /** Decimal year the model's validity ends (2030.0, exclusive). */
  export const MODEL_VALID_UNTIL: number;
}
