import { ref } from 'vue';
import type { GeoPoint } from '../../shared/geo';

/** How long to wait for a position, ms. */
export const GEOLOCATION_TIMEOUT_MS = 15_000;

function messageFor(error: GeolocationPositionError): string {
  switch (error.code) {
    case error.PERMISSION_DENIED:
      return 'Location was refused. Allow location for this site in the browser, or type the coordinates.';
    case error.POSITION_UNAVAILABLE:
      return 'Your device could not find its position. Try again outdoors, or type the coordinates.';
    case error.TIMEOUT:
      return 'Finding your position took too long. Try again, or type the coordinates.';
    default:
      return 'Your position is not available. Type the coordinates instead.';
  }
}

/** "Use my location": one position from the browser, with a message a user can act on when it fails. */
export function useGeolocation() {
  const locating = ref(false);
  const message = ref('');

  function locate(): Promise<(GeoPoint & { accuracyM: number }) | null> {
    message.value = '';
    if (typeof navigator === 'undefined' || !('geolocation' in navigator)) {
      message.value = 'This browser cannot share its location. Type the coordinates instead.';
      return Promise.resolve(null);
    }
    if (!window.isSecureContext) {
      message.value = 'Location needs a secure (https) connection. Type the coordinates instead.';
      return Promise.resolve(null);
    }
    locating.value = true;
    return new Promise((resolve) => {
      navigator.geolocation.getCurrentPosition(
        (position) => {
          locating.value = false;
          resolve({ lat: position.coords.latitude, lon: position.coords.longitude, accuracyM: position.coords.accuracy });
        },
        (error) => {
          locating.value = false;
          message.value = messageFor(error);
          resolve(null);
        },
        { enableHighAccuracy: true, timeout: GEOLOCATION_TIMEOUT_MS, maximumAge: 60_000 },
      );
    });
  }

  return { locating, message, locate };
}
