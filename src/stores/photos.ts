import { defineStore } from 'pinia';
import { computed, reactive, ref } from 'vue';
import type { Photo, PhotoCalibrationInput } from '../../shared/schemas/photo';
import * as photosApi from '@/api/photos';

/** One file on its way up. */
export interface PhotoUploadItem {
  key: number;
  name: string;
  /** 0..100 */
  percent: number;
  status: 'uploading' | 'done' | 'error';
  error: string;
}

/**
 * The reference photos of the open sightline: the list, uploads with progress, the selected
 * photo, and the changes an editor can make (GPS privacy, calibration, delete).
 */
export const usePhotosStore = defineStore('photos', () => {
  const sightlineId = ref<string | null>(null);
  const photos = ref<Photo[]>([]);
  const loading = ref(false);
  const loadError = ref('');
  const uploads = reactive<PhotoUploadItem[]>([]);
  const selectedId = ref<string | null>(null);
  let nextKey = 1;
  let loadToken = 0;

  const selected = computed(() => photos.value.find((p) => p.id === selectedId.value) ?? null);

  function replace(photo: Photo): void {
    photos.value = photos.value.map((p) => (p.id === photo.id ? photo : p));
  }

  /** Loads the photos of a sightline (again when `force`). */
  async function load(id: string, force = false): Promise<void> {
    if (!force && sightlineId.value === id && !loadError.value) return;
    const token = ++loadToken;
    if (sightlineId.value !== id) {
      photos.value = [];
      selectedId.value = null;
      uploads.splice(0);
    }
    sightlineId.value = id;
    loading.value = true;
    loadError.value = '';
    try {
      const list = await photosApi.listPhotos(id);
      if (token !== loadToken) return;
      photos.value = list;
      if (!selected.value) selectedId.value = list[0]?.id ?? null;
    } catch (error) {
      if (token === loadToken) loadError.value = (error as Error).message;
    } finally {
      if (token === loadToken) loading.value = false;
    }
  }

  /** Uploads one file; its progress and outcome show in `uploads`. Resolves with the photo or null. */
  async function upload(file: File): Promise<Photo | null> {
    const id = sightlineId.value;
    if (!id) throw new Error('No sightline is open');
    const item = reactive<PhotoUploadItem>({ key: nextKey++, name: file.name, percent: 0, status: 'uploading', error: '' });
    uploads.push(item);
    try {
      const photo = await photosApi.uploadPhoto(id, file, ({ loaded, total }) => {
        item.percent = total > 0 ? Math.min(99, Math.round((loaded / total) * 100)) : 0;
      });
      item.percent = 100;
      item.status = 'done';
      if (sightlineId.value === id) {
        photos.value = [...photos.value, photo];
        selectedId.value = photo.id;
      }
      return photo;
    } catch (error) {
      item.status = 'error';
      item.error = (error as Error).message;
      return null;
    }
  }

  /** Forgets finished and failed uploads from the progress list. */
  function clearFinishedUploads(): void {
    for (let i = uploads.length - 1; i >= 0; i--) if (uploads[i]!.status !== 'uploading') uploads.splice(i, 1);
  }

  async function setHideGps(photoId: string, hideGps: boolean): Promise<void> {
    replace(await photosApi.setHideGps(photoId, hideGps));
  }

  async function saveCalibration(photoId: string, input: PhotoCalibrationInput): Promise<Photo> {
    const photo = await photosApi.saveCalibration(photoId, input);
    replace(photo);
    return photo;
  }

  async function clearCalibration(photoId: string): Promise<void> {
    replace(await photosApi.clearCalibration(photoId));
  }

  async function remove(photoId: string): Promise<void> {
    await photosApi.deletePhoto(photoId);
    photos.value = photos.value.filter((p) => p.id !== photoId);
    if (selectedId.value === photoId) selectedId.value = photos.value[0]?.id ?? null;
  }

  function select(photoId: string): void {
    selectedId.value = photoId;
  }

  return {
    sightlineId, photos, loading, loadError, uploads, selectedId, selected,
    load, upload, clearFinishedUploads, setHideGps, saveCalibration, clearCalibration, remove, select,
  };
});
