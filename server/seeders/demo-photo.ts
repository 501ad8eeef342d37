/**
 * An invented daytime reference photo for the demo: a drawn scene (sky, sea to a level horizon and
 * a dark stack) laid out with the sightline's own geometry, so the sky overlay lines up with it,
 * with EXIF saying it was taken at the vantage with a 24 mm-equivalent lens.
 */
import sharp from 'sharp';
import type { Sightline } from '../../shared/schemas/sightline';
import type { PhotoCalibrationInput } from '../../shared/schemas/photo';
import { sightlineGeometry } from '../../shared/geo';
import { skyToPixel, solvePhotoCalibration } from '../../shared/projection';

const WIDTH = 1800;
const HEIGHT = 1200;
const FOCAL_35_MM = 24;

/** EXIF GPS rational triple 'd/1 m/1 s/1000' for a positive angle. */
function dms(value: number): string {
  const a = Math.abs(value);
  const d = Math.floor(a);
  const m = Math.floor((a - d) * 60);
  const s = Math.round(((a - d) * 60 - m) * 60 * 1000);
  return `${d}/1 ${m}/1 ${s}/1000`;
}

/** The drawn photo and the calibration that matches it (the stack's top and two points on the horizon). */
export async function demoScenePhoto(sightline: Sightline): Promise<{ jpeg: Buffer; calibration: PhotoCalibrationInput; name: string }> {
  const g = sightlineGeometry(sightline.vantage, sightline.landmark);
  const top = { x: WIDTH / 2, y: HEIGHT * 0.47 };
  const fov = { kind: 'equivalent35' as const, focal35Mm: FOCAL_35_MM };
  const { pose } = solvePhotoCalibration({ landmarkTopPx: top, fov }, { azimuthDeg: g.trueBearingDeg, altitudeDeg: g.topElevationDeg }, { widthPx: WIDTH, heightPx: HEIGHT });
  const at = (dAz: number, alt: number) => skyToPixel(pose, { azimuthDeg: (g.trueBearingDeg + dAz + 360) % 360, altitudeDeg: alt });
  const horizonY = at(0, 0).y;
  const half = g.angularWidthDeg / 2;
  const baseLeft = at(-half, g.baseElevationDeg);
  const baseRight = at(half, g.baseElevationDeg);
  const shoulderL = at(-half * 0.55, g.topElevationDeg * 0.8 + g.baseElevationDeg * 0.2);
  const shoulderR = at(half * 0.5, g.topElevationDeg * 0.7 + g.baseElevationDeg * 0.3);
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}">
  <defs>
    <linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#4f7fb8"/><stop offset="1" stop-color="#d6e4ef"/></linearGradient>
    <linearGradient id="sea" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#3d6a84"/><stop offset="1" stop-color="#1f3b4d"/></linearGradient>
  </defs>
  <rect width="${WIDTH}" height="${horizonY.toFixed(1)}" fill="url(#sky)"/>
  <rect y="${horizonY.toFixed(1)}" width="${WIDTH}" height="${(HEIGHT - horizonY).toFixed(1)}" fill="url(#sea)"/>
  <path d="M ${baseLeft.x.toFixed(1)} ${(baseLeft.y + 6).toFixed(1)} L ${shoulderL.x.toFixed(1)} ${shoulderL.y.toFixed(1)} L ${(top.x - 8).toFixed(1)} ${(top.y + 4).toFixed(1)} L ${top.x} ${top.y} L ${(top.x + 10).toFixed(1)} ${(top.y + 6).toFixed(1)} L ${shoulderR.x.toFixed(1)} ${shoulderR.y.toFixed(1)} L ${baseRight.x.toFixed(1)} ${(baseRight.y + 6).toFixed(1)} Z" fill="#2e2822"/>
  <rect y="${(HEIGHT - 140).toFixed(1)}" width="${WIDTH}" height="140" fill="#c9b48a"/>
</svg>`;
  const { lat, lon } = sightline.vantage;
  const jpeg = await sharp(Buffer.from(svg))
    .jpeg({ quality: 82 })
    .withExif({
      IFD0: { Make: 'Invented', Model: 'Demo scout' },
      IFD2: { DateTimeOriginal: '2026:05:02 15:10:00', FocalLength: '16/1', FocalLengthIn35mmFilm: String(FOCAL_35_MM) },
      IFD3: {
        GPSLatitudeRef: lat >= 0 ? 'N' : 'S', GPSLatitude: dms(lat),
        GPSLongitudeRef: lon >= 0 ? 'E' : 'W', GPSLongitude: dms(lon),
      },
    })
    .toBuffer();
  const calibration: PhotoCalibrationInput = {
    landmarkTopPx: top,
    fov,
    horizonPx: [{ x: at(-25, 0).x, y: at(-25, 0).y }, { x: at(25, 0).x, y: at(25, 0).y }],
  };
  return { jpeg, calibration, name: 'demo-daytime-scouting.jpg' };
}
