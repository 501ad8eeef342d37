import { computed } from 'vue';
import { landmarkSchema, vantageSchema } from '../../shared/schemas/geometry';
import { usePlannerStore, type HeightKey, type PinKind } from '@/stores/planner';
import { useUnits } from './useUnits';

interface HeightFieldSpec {
  key: HeightKey;
  pin: PinKind;
  label: string;
  hint: string;
  /** Bounds in metres, read from the shared schema so client and server agree. */
  minM: number;
  maxM: number;
}

function bounds(schema: { unwrap(): { minValue: number | null; maxValue: number | null } }): { minM: number; maxM: number } {
  const n = schema.unwrap();
  return { minM: n.minValue ?? -Infinity, maxM: n.maxValue ?? Infinity };
}

const SPECS: readonly HeightFieldSpec[] = [
  { key: 'vantageElevationM', pin: 'vantage', label: 'Ground elevation', hint: 'Height of the ground at the vantage above sea level', ...bounds(vantageSchema.shape.elevationM) },
  { key: 'cameraHeightM', pin: 'vantage', label: 'Camera height', hint: 'Lens height above that ground', ...bounds(vantageSchema.shape.cameraHeightM) },
  { key: 'landmarkBaseElevationM', pin: 'landmark', label: 'Base elevation', hint: 'Height of the landmark\'s foot above sea level', ...bounds(landmarkSchema.shape.baseElevationM) },
  { key: 'landmarkHeightM', pin: 'landmark', label: 'Height', hint: 'From its foot to its top', ...bounds(landmarkSchema.shape.heightM) },
  { key: 'landmarkWidthM', pin: 'landmark', label: 'Width', hint: 'Across, as seen from the vantage', ...bounds(landmarkSchema.shape.widthM) },
];

/** One height field as the form shows it: value in the display unit, bounds and error. */
export interface HeightField extends HeightFieldSpec {
  unit: string;
  value: number | null;
  min: number;
  max: number;
  error: string;
}

const round2 = (x: number) => Math.round(x * 100) / 100;

/**
 * The editable heights of the vantage and the landmark, shown in the user's units and checked
 * against the shared schema's bounds; the store keeps metres.
 */
export function useHeightFields() {
  const store = usePlannerStore();
  const u = useUnits();

  const fields = computed<HeightField[]>(() => SPECS.map((spec) => {
    const metres = store.heights[spec.key];
    const min = round2(u.toDisplay(spec.minM));
    const max = round2(u.toDisplay(spec.maxM));
    let error = '';
    if (metres === null || !Number.isFinite(metres)) error = 'Enter a value';
    else if (metres < spec.minM - 1e-9 || metres > spec.maxM + 1e-9) error = `Between ${min} and ${max} ${u.heightUnit.value}`;
    return { ...spec, unit: u.heightUnit.value, value: metres === null ? null : round2(u.toDisplay(metres)), min, max, error };
  }));

  const hasErrors = computed(() => fields.value.some((f) => f.error !== ''));

  function update(key: HeightKey, displayValue: number | null): void {
    store.setHeight(key, displayValue === null ? null : u.fromDisplay(displayValue));
  }

  return { fields, hasErrors, update };
}
