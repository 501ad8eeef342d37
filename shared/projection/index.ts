/**
 * Projection maths for the sky overlay: the rectilinear camera model, calibration from a
 * clicked landmark (and horizon), and drawing helpers that project sky polylines into a photo.
 */
export * from './camera';
export * from './calibrate';
export * from './overlay';
export * from './track';
export * from './photo-calibration';
