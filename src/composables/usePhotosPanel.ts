import { computed, inject, provide, toRef, watch, type InjectionKey } from 'vue';
import { useSessionStore } from '@/stores/session';
import { usePhotosStore } from '@/stores/photos';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { useLineupsStore } from '@/stores/lineups';
import { usePhotoCalibration } from './usePhotoCalibration';
import { useSkyOverlay } from './useSkyOverlay';

function createPanel() {
  const store = usePhotosStore();
  const detail = useSightlineDetailStore();
  const lineups = useLineupsStore();
  const session = useSessionStore();

  watch(() => detail.id, (id) => { if (id) void store.load(id); }, { immediate: true });

  const photo = toRef(store, 'selected');
  const calibration = usePhotoCalibration(photo, toRef(detail, 'geometry'));
  const overlay = useSkyOverlay(photo, toRef(detail, 'site'), computed(() => lineups.search.result));
  const isOwner = computed(() => photo.value !== null && photo.value.ownerId === session.user?.id);
  const picking = computed(() => calibration.step.value !== 'idle');

  return { store, detail, photo, calibration, overlay, isOwner, picking };
}
export type PhotosPanel = ReturnType<typeof createPanel>;

const panelKey: InjectionKey<PhotosPanel> = Symbol('photos panel');

/** The photos section of a sightline page: gallery, the selected photo, its calibration and overlay. Created once by the panel. */
export function usePhotosPanel(): PhotosPanel {
  const panel = createPanel();
  provide(panelKey, panel);
  return panel;
}

/** The panel's state inside one of its parts. */
export function usePhotosPanelContext(): PhotosPanel {
  const panel = inject(panelKey);
  if (!panel) throw new Error('usePhotosPanelContext() outside the photos panel');
  return panel;
}
