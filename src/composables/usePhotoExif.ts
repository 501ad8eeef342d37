import { computed, ref, type Ref } from 'vue';
import { useDialog, useMessage } from 'naive-ui';
import type { Photo } from '../../shared/schemas/photo';
import { distanceM } from '../../shared/geo';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { usePhotosStore } from '@/stores/photos';
import { formatDistance, useUnits } from './useUnits';

/** Beyond this distance between where the photo was taken and the vantage, we warn, m. */
export const PHOTO_VANTAGE_WARN_M = 50;

/** 'YYYY-MM-DDTHH:mm:ss[+hh:mm]' as the camera wrote it, shown as '2026-06-15 14:30:05 (+01:00)'. */
export function takenAtText(takenAt: string | undefined): string {
  if (!takenAt) return '';
  const m = /^(\d{4}-\d{2}-\d{2})T(\d{2}:\d{2}(?::\d{2})?)(.*)$/.exec(takenAt);
  if (!m) return takenAt;
  return m[3] ? `${m[1]} ${m[2]} (${m[3]})` : `${m[1]} ${m[2]} (camera clock, zone not recorded)`;
}

/**
 * The details of a photo: its EXIF as rows, how far from the vantage it was taken (a warning
 * beyond 50 m), "set the vantage here", the GPS privacy switch and delete.
 */
export function usePhotoExif(photo: Ref<Photo | null>) {
  const detail = useSightlineDetailStore();
  const photos = usePhotosStore();
  const { units } = useUnits();
  const dialog = useDialog();
  const message = useMessage();
  const busy = ref(false);

  const gps = computed(() => photo.value?.exif.gps ?? null);

  const rows = computed(() => {
    const p = photo.value;
    if (!p) return [];
    const e = p.exif;
    const out: { label: string; value: string }[] = [];
    if (e.takenAt) out.push({ label: 'Taken', value: takenAtText(e.takenAt) });
    if (e.camera) out.push({ label: 'Camera', value: e.camera });
    if (e.lens) out.push({ label: 'Lens', value: e.lens });
    if (e.focalLengthMm) out.push({ label: 'Focal length', value: `${+e.focalLengthMm.toFixed(1)} mm` });
    if (e.focalLength35Mm) out.push({ label: '35 mm equivalent', value: `${+e.focalLength35Mm.toFixed(1)} mm` });
    if (e.gps) out.push({ label: 'GPS', value: `${e.gps.lat.toFixed(5)}, ${e.gps.lon.toFixed(5)}` });
    if (e.imageDirectionDeg !== undefined) out.push({ label: 'Camera bearing', value: `${e.imageDirectionDeg.toFixed(1)}° (as the camera recorded it)` });
    out.push({ label: 'Size', value: `${p.width} × ${p.height} px` });
    return out;
  });

  /** Distance from the photo's GPS position to the vantage, m; null without GPS. */
  const distanceFromVantageM = computed(() => {
    const g = gps.value;
    const s = detail.sightline;
    if (!g || !s) return null;
    try {
      return distanceM(g, s.vantage);
    } catch {
      return null;
    }
  });

  const distanceText = computed(() => (distanceFromVantageM.value === null ? '' : formatDistance(distanceFromVantageM.value, units.value)));
  const farFromVantage = computed(() => (distanceFromVantageM.value ?? 0) > PHOTO_VANTAGE_WARN_M);

  /** Asks, then moves the vantage to the photo's GPS position (the page then searches again). */
  function setVantageHere(): void {
    const g = gps.value;
    if (!g) return;
    dialog.warning({
      title: 'Set the vantage here?',
      content: `The vantage moves to ${g.lat.toFixed(5)}, ${g.lon.toFixed(5)}, where this photo was taken. Its ground elevation and camera height stay as they are: check them. Phone and camera GPS can be tens of metres off.`,
      positiveText: 'Move the vantage',
      negativeText: 'Cancel',
      onPositiveClick: async () => {
        busy.value = true;
        try {
          await detail.moveVantage(g.lat, g.lon);
          message.success('The vantage moved to the photo position');
        } catch (error) {
          message.error((error as Error).message);
        } finally {
          busy.value = false;
        }
      },
    });
  }

  async function setHideGps(hide: boolean): Promise<void> {
    const p = photo.value;
    if (!p) return;
    try {
      await photos.setHideGps(p.id, hide);
    } catch (error) {
      message.error((error as Error).message);
    }
  }

  function confirmDelete(): void {
    const p = photo.value;
    if (!p) return;
    dialog.warning({
      title: 'Delete this photo?',
      content: `“${p.originalName}” and its calibration are deleted for everyone. This cannot be undone.`,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      onPositiveClick: async () => {
        try {
          await photos.remove(p.id);
          message.success('Photo deleted');
        } catch (error) {
          message.error((error as Error).message);
        }
      },
    });
  }

  return { rows, gps, distanceFromVantageM, distanceText, farFromVantage, busy, setVantageHere, setHideGps, confirmDelete };
}
