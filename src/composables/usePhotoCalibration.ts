import { computed, reactive, ref, watch, type Ref } from 'vue';
import {
  photoCalibrationInputSchema,
  type Photo,
  type PhotoCalibrationInput,
  type PhotoFovInput,
} from '../../shared/schemas/photo';
import type { SightlineGeometry } from '../../shared/geo';
import { FULL_FRAME_WIDTH_MM, type PixelPoint } from '../../shared/projection';
import { usePhotosStore } from '@/stores/photos';
import { useFieldErrors } from './useFieldErrors';

/** What the next click in the photo marks. */
export type CalibrationStep = 'idle' | 'landmark' | 'horizon-1' | 'horizon-2';

/** How the lens is given in the form. */
export type FovKind = PhotoFovInput['kind'];

export const FOV_KIND_OPTIONS: { label: string; value: FovKind }[] = [
  { label: '35 mm-equivalent focal length', value: 'equivalent35' },
  { label: 'Focal length + sensor width', value: 'focal' },
  { label: 'Horizontal field of view', value: 'angle' },
];

/** How far the landmark direction may drift from the calibrated one before we ask to redo it, deg. */
const STALE_CALIBRATION_DEG = 0.05;

type CalibrationField = 'landmarkTopPx' | 'horizonPx' | 'fov.focalLengthMm' | 'fov.sensorWidthMm' | 'fov.focal35Mm' | 'fov.horizontalFovDeg' | 'fov.kind';

/** The lens form, prefilled from the saved calibration or else from EXIF. */
function lensFromPhoto(photo: Photo | null) {
  const saved = photo?.calibration?.fov;
  const exif = photo?.exif ?? {};
  return {
    kind: (saved?.kind ?? (exif.focalLength35Mm ? 'equivalent35' : exif.focalLengthMm ? 'focal' : 'equivalent35')) as FovKind,
    focal35Mm: saved?.kind === 'equivalent35' ? saved.focal35Mm : exif.focalLength35Mm ?? null,
    focalLengthMm: saved?.kind === 'focal' ? saved.focalLengthMm : exif.focalLengthMm ?? null,
    sensorWidthMm: saved?.kind === 'focal' ? saved.sensorWidthMm : FULL_FRAME_WIDTH_MM,
    horizontalFovDeg: saved?.kind === 'angle' ? saved.horizontalFovDeg : null,
  } as { kind: FovKind; focal35Mm: number | null; focalLengthMm: number | null; sensorWidthMm: number | null; horizontalFovDeg: number | null };
}

/**
 * Calibrating a photo for the sky overlay: click the landmark top, optionally two horizon points,
 * give the lens, save (the server solves the pose). Clicks are kept in the upright original's pixels.
 */
export function usePhotoCalibration(photo: Ref<Photo | null>, geometry: Ref<SightlineGeometry | null>) {
  const store = usePhotosStore();
  const step = ref<CalibrationStep>('idle');
  const landmarkTop = ref<PixelPoint | null>(null);
  const horizon = ref<PixelPoint[]>([]);
  const lens = reactive(lensFromPhoto(null));
  const errors = useFieldErrors<CalibrationField>();
  const saving = ref(false);

  function resetFrom(p: Photo | null): void {
    step.value = 'idle';
    landmarkTop.value = p?.calibration?.landmarkTopPx ?? null;
    horizon.value = p?.calibration?.horizonPx ? [...p.calibration.horizonPx] : [];
    Object.assign(lens, lensFromPhoto(p));
    errors.clear();
  }
  watch(() => photo.value?.id, () => resetFrom(photo.value), { immediate: true });

  const prompt = computed(() => ({
    idle: '',
    landmark: 'Click the top of the landmark in the photo.',
    'horizon-1': 'Click a point on a level horizon (sea or plain), or skip.',
    'horizon-2': 'Click a second point on the same horizon, well apart from the first.',
  })[step.value]);

  function start(): void {
    errors.clear();
    landmarkTop.value = null;
    horizon.value = [];
    step.value = 'landmark';
  }

  function markHorizon(): void {
    horizon.value = [];
    step.value = 'horizon-1';
  }

  function skipHorizon(): void {
    horizon.value = [];
    step.value = 'idle';
  }

  function cancel(): void {
    resetFrom(photo.value);
  }

  /** Takes a click in the photo, in the original's pixels. */
  function click(point: PixelPoint): void {
    if (step.value === 'landmark') {
      landmarkTop.value = point;
      step.value = 'horizon-1';
    } else if (step.value === 'horizon-1') {
      horizon.value = [point];
      step.value = 'horizon-2';
    } else if (step.value === 'horizon-2') {
      horizon.value = [horizon.value[0]!, point];
      step.value = 'idle';
    }
  }

  function fovInput(): PhotoFovInput | null {
    if (lens.kind === 'equivalent35') return lens.focal35Mm === null ? null : { kind: 'equivalent35', focal35Mm: lens.focal35Mm };
    if (lens.kind === 'focal') {
      return lens.focalLengthMm === null || lens.sensorWidthMm === null ? null : { kind: 'focal', focalLengthMm: lens.focalLengthMm, sensorWidthMm: lens.sensorWidthMm };
    }
    return lens.horizontalFovDeg === null ? null : { kind: 'angle', horizontalFovDeg: lens.horizontalFovDeg };
  }

  const canSave = computed(() => landmarkTop.value !== null && step.value !== 'landmark' && step.value !== 'horizon-2');

  /** Checks the input with the shared schema, then saves; field messages land in `errors`. */
  async function save(): Promise<boolean> {
    const p = photo.value;
    errors.clear();
    if (!p) return false;
    if (!landmarkTop.value) {
      errors.fields.landmarkTopPx = 'Click the landmark top in the photo first';
      return false;
    }
    const fov = fovInput();
    if (!fov) {
      const field: CalibrationField = lens.kind === 'equivalent35' ? 'fov.focal35Mm' : lens.kind === 'focal' ? (lens.focalLengthMm === null ? 'fov.focalLengthMm' : 'fov.sensorWidthMm') : 'fov.horizontalFovDeg';
      errors.fields[field] = 'Fill this in';
      return false;
    }
    const body: PhotoCalibrationInput = { landmarkTopPx: landmarkTop.value, fov, ...(horizon.value.length === 2 ? { horizonPx: [horizon.value[0]!, horizon.value[1]!] } : {}) };
    const parsed = photoCalibrationInputSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = issue.path.join('.') as CalibrationField;
        errors.fields[key] ??= issue.message;
      }
      return false;
    }
    saving.value = true;
    try {
      await store.saveCalibration(p.id, parsed.data);
      step.value = 'idle';
      return true;
    } catch (error) {
      if (!errors.take(error)) throw error;
      return false;
    } finally {
      saving.value = false;
    }
  }

  async function clear(): Promise<void> {
    const p = photo.value;
    if (!p) return;
    try {
      await store.clearCalibration(p.id);
      resetFrom(photo.value);
    } catch (error) {
      if (!errors.take(error)) throw error;
    }
  }

  /** True when the pins moved since the calibration, so the overlay is off. */
  const stale = computed(() => {
    const c = photo.value?.calibration;
    const g = geometry.value;
    if (!c || !g) return false;
    const dAz = Math.abs(((c.landmark.azimuthDeg - g.trueBearingDeg + 540) % 360) - 180);
    return dAz > STALE_CALIBRATION_DEG || Math.abs(c.landmark.altitudeDeg - g.topElevationDeg) > STALE_CALIBRATION_DEG;
  });

  return { step, prompt, landmarkTop, horizon, lens, errors, saving, canSave, stale, start, markHorizon, skipHorizon, cancel, click, save, clear };
}
export type PhotoCalibrationState = ReturnType<typeof usePhotoCalibration>;
