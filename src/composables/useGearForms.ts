import { computed, reactive } from 'vue';
import { fieldErrorsFromZod } from '../../shared/errors';
import { cameraBodySchema, lensSchema, MAX_GEAR_NAME_CHARS } from '../../shared/schemas/gear';
import type { CameraBodyInput, CameraBodyPatch, CameraBodyRecord, LensInput, LensPatch, LensRecord } from '../../shared/schemas/shot-plan';
import { deriveBody, type DerivedBody } from '../../shared/shotplan/gear';
import { useFieldErrors } from './useFieldErrors';

export { MAX_GEAR_NAME_CHARS };

/** The fields of the camera body form that can carry a message. */
export type BodyFormField = 'name' | 'sensorWidthMm' | 'sensorHeightMm' | 'pixelPitchUm' | 'widthPx' | 'megapixels';
/** The fields of the lens form that can carry a message. */
export type LensFormField = 'name' | 'focalLengthMm' | 'zoomMinMm' | 'zoomMaxMm' | 'widestApertureF';

const set = (n: number | null | undefined) => (n === null || n === undefined ? undefined : n);

/**
 * The camera body form, for a new body and for editing one: name, sensor size and one or more
 * pixel figures. Checked with the shared schema (the server's messages land beside the same
 * fields); the crop factor and pixel pitch show as soon as the figures make sense.
 */
export function useBodyForm() {
  const form = reactive({
    name: '',
    sensorWidthMm: null as number | null,
    sensorHeightMm: null as number | null,
    pixelPitchUm: null as number | null,
    widthPx: null as number | null,
    megapixels: null as number | null,
  });
  const errors = useFieldErrors<BodyFormField>();

  function input(): unknown {
    return {
      name: form.name,
      sensorWidthMm: set(form.sensorWidthMm),
      sensorHeightMm: set(form.sensorHeightMm),
      pixelPitchUm: set(form.pixelPitchUm),
      widthPx: set(form.widthPx),
      megapixels: set(form.megapixels),
    };
  }

  /** Crop factor, pixel pitch and pixel grid of what is typed, or null while it does not pass the schema. */
  const derived = computed<DerivedBody | null>(() => {
    const parsed = cameraBodySchema.safeParse(input());
    return parsed.success ? deriveBody(parsed.data) : null;
  });

  /** The body to send, or null with the messages placed beside the fields. */
  function validated(): CameraBodyInput | null {
    errors.clear();
    const parsed = cameraBodySchema.safeParse(input());
    if (parsed.success) return parsed.data;
    Object.assign(errors.fields, fieldErrorsFromZod(parsed.error));
    return null;
  }

  /** A change that replaces every field (empty pixel figures cleared). */
  function patchOf(body: CameraBodyInput): CameraBodyPatch {
    return {
      name: body.name,
      sensorWidthMm: body.sensorWidthMm,
      sensorHeightMm: body.sensorHeightMm,
      pixelPitchUm: body.pixelPitchUm ?? null,
      widthPx: body.widthPx ?? null,
      megapixels: body.megapixels ?? null,
    };
  }

  function fill(record: CameraBodyRecord | null): void {
    errors.clear();
    form.name = record?.name ?? '';
    form.sensorWidthMm = record?.sensorWidthMm ?? null;
    form.sensorHeightMm = record?.sensorHeightMm ?? null;
    form.pixelPitchUm = record?.pixelPitchUm ?? null;
    form.widthPx = record?.widthPx ?? null;
    form.megapixels = record?.megapixels ?? null;
  }

  return { form, errors, feedback: errors.feedback, derived, validated, patchOf, fill };
}
export type BodyForm = ReturnType<typeof useBodyForm>;

/**
 * The lens form: name, a prime's focal length or a zoom's two ends, and the widest aperture.
 * Checked with the shared schema.
 */
export function useLensForm() {
  const form = reactive({
    name: '',
    kind: 'prime' as 'prime' | 'zoom',
    focalLengthMm: null as number | null,
    zoomMinMm: null as number | null,
    zoomMaxMm: null as number | null,
    widestApertureF: null as number | null,
  });
  const errors = useFieldErrors<LensFormField>();

  function input(): unknown {
    return form.kind === 'prime'
      ? { name: form.name, focalLengthMm: set(form.focalLengthMm), widestApertureF: set(form.widestApertureF) }
      : { name: form.name, zoomMinMm: set(form.zoomMinMm), zoomMaxMm: set(form.zoomMaxMm), widestApertureF: set(form.widestApertureF) };
  }

  function validated(): LensInput | null {
    errors.clear();
    const parsed = lensSchema.safeParse(input());
    if (parsed.success) return parsed.data;
    Object.assign(errors.fields, fieldErrorsFromZod(parsed.error));
    return null;
  }

  /** A change that replaces every field: a prime clears the zoom's ends, a zoom the prime's focal length. */
  function patchOf(lens: LensInput): LensPatch {
    return lens.focalLengthMm !== undefined
      ? { name: lens.name, focalLengthMm: lens.focalLengthMm, zoomMinMm: null, zoomMaxMm: null, widestApertureF: lens.widestApertureF }
      : { name: lens.name, focalLengthMm: null, zoomMinMm: lens.zoomMinMm ?? null, zoomMaxMm: lens.zoomMaxMm ?? null, widestApertureF: lens.widestApertureF };
  }

  function fill(record: LensRecord | null): void {
    errors.clear();
    form.name = record?.name ?? '';
    form.kind = record && record.focalLengthMm === null ? 'zoom' : 'prime';
    form.focalLengthMm = record?.focalLengthMm ?? null;
    form.zoomMinMm = record?.zoomMinMm ?? null;
    form.zoomMaxMm = record?.zoomMaxMm ?? null;
    form.widestApertureF = record?.widestApertureF ?? null;
  }

  return { form, errors, feedback: errors.feedback, validated, patchOf, fill };
}
export type LensForm = ReturnType<typeof useLensForm>;
