import {
  photoListResponseSchema,
  photoResponseSchema,
  type Photo,
  type PhotoCalibrationInput,
} from '../../shared/schemas/photo';
import { apiErrorBodySchema } from '../../shared/errors';
import { ApiError, request } from './client';

/** The form field the server reads the file from. */
export const PHOTO_FORM_FIELD = 'photo';

const listPath = (sightlineId: string) => `/sightlines/${encodeURIComponent(sightlineId)}/photos`;
const photoPath = (photoId: string) => `/photos/${encodeURIComponent(photoId)}`;

/** GET /api/sightlines/:id/photos. */
export async function listPhotos(sightlineId: string): Promise<Photo[]> {
  return (await request('GET', listPath(sightlineId), { schema: photoListResponseSchema })).photos;
}

/** PATCH /api/photos/:id: show or hide the GPS position to others. */
export async function setHideGps(photoId: string, hideGps: boolean): Promise<Photo> {
  return (await request('PATCH', photoPath(photoId), { body: { hideGps }, schema: photoResponseSchema })).photo;
}

/** PUT /api/photos/:id/calibration: the server solves and saves the pose. */
export async function saveCalibration(photoId: string, input: PhotoCalibrationInput): Promise<Photo> {
  return (await request('PUT', `${photoPath(photoId)}/calibration`, { body: input, schema: photoResponseSchema })).photo;
}

/** DELETE /api/photos/:id/calibration. */
export async function clearCalibration(photoId: string): Promise<Photo> {
  return (await request('DELETE', `${photoPath(photoId)}/calibration`, { schema: photoResponseSchema })).photo;
}

/** DELETE /api/photos/:id. */
export async function deletePhoto(photoId: string): Promise<void> {
  await request('DELETE', photoPath(photoId));
}

/** Upload progress: bytes sent of the total. */
export interface UploadProgress {
  loaded: number;
  total: number;
}

/**
 * POST /api/sightlines/:id/photos as multipart form data. XMLHttpRequest rather than fetch:
 * fetch reports no upload progress in browsers. Errors come back as ApiError like `request()`.
 */
export function uploadPhoto(
  sightlineId: string,
  file: File,
  onProgress: (progress: UploadProgress) => void,
  signal?: AbortSignal,
): Promise<Photo> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `/api${listPath(sightlineId)}`);
    xhr.withCredentials = true;
    xhr.upload.onprogress = (event) => {
      if (event.lengthComputable) onProgress({ loaded: event.loaded, total: event.total });
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'The upload did not reach the Gnomon server. Check your connection and try again.'));
    xhr.onabort = () => reject(new DOMException('The upload was cancelled', 'AbortError'));
    xhr.onload = () => {
      let json: unknown;
      try {
        json = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        json = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        const parsed = photoResponseSchema.safeParse(json);
        if (parsed.success) resolve(parsed.data.photo);
        else reject(new ApiError(xhr.status, 'internal', 'The server sent an answer this page does not understand'));
        return;
      }
      const error = apiErrorBodySchema.safeParse(json);
      if (error.success) reject(new ApiError(xhr.status, error.data.error.code, error.data.error.message, error.data.error.fields));
      else reject(new ApiError(xhr.status, 'internal', `The server answered ${xhr.status}`));
    };
    signal?.addEventListener('abort', () => xhr.abort(), { once: true });
    const form = new FormData();
    form.append(PHOTO_FORM_FIELD, file, file.name);
    xhr.send(form);
  });
}
