/**
 * The map's own markers as Leaflet divIcons with inline SVG. Colours come from CSS (classes
 * styled in ScoutingMap.vue from --gn-map-* variables), so the red night-vision theme recolours
 * them; shapes stay distinct without colour: a tripod-like triangle for the vantage, a diamond
 * for the landmark.
 */
import { divIcon, type DivIconOptions, type Icon } from 'leaflet';
import { escapeHtml } from '../../../shared/html';

/**
 * A divIcon typed as @vue-leaflet's `icon` prop wants it (L.Icon); Leaflet's markers take any
 * icon, DivIcon included.
 */
function markerIcon(options: DivIconOptions): Icon {
  return divIcon(options) as unknown as Icon;
}

const VANTAGE_SVG = `
<svg viewBox="0 0 30 30" width="30" height="30" aria-hidden="true" focusable="false">
  <path class="gn-pin-body" d="M15 3 L27 26 L3 26 Z" />
  <path class="gn-pin-mark" d="M15 9 L9 23 M15 9 L21 23 M15 9 L15 23" />
  <circle class="gn-pin-centre" cx="15" cy="18" r="2.2" />
</svg>`;

const LANDMARK_SVG = `
<svg viewBox="0 0 30 30" width="30" height="30" aria-hidden="true" focusable="false">
  <path class="gn-pin-body" d="M15 2 L28 15 L15 28 L2 15 Z" />
  <path class="gn-pin-mark" d="M15 8 L22 15 L15 22 L8 15 Z" />
  <circle class="gn-pin-centre" cx="15" cy="15" r="2.2" />
</svg>`;

/** The vantage pin: the point is the triangle's centre dot. */
export const vantageIcon: Icon = markerIcon({
  className: 'gn-pin gn-pin-vantage',
  html: VANTAGE_SVG,
  iconSize: [30, 30],
  iconAnchor: [15, 18],
});

/** The landmark pin: the point is the diamond's centre. */
export const landmarkIcon: Icon = markerIcon({
  className: 'gn-pin gn-pin-landmark',
  html: LANDMARK_SVG,
  iconSize: [30, 30],
  iconAnchor: [15, 15],
});

/** A candidate spot of "where to stand", labelled with the elevation angle it gives. */
export function spotIcon(label: string, exact: boolean): Icon {
  return markerIcon({
    className: exact ? 'gn-spot gn-spot-exact' : 'gn-spot',
    html: `<span class="gn-spot-dot"></span><span class="gn-spot-label">${escapeHtml(label)}</span>`,
    iconSize: [14, 14],
    iconAnchor: [7, 7],
  });
}

/** A text label at the end of a ray or on the grid. */
export function labelIcon(className: string, label: string): Icon {
  return markerIcon({ className, html: `<span>${escapeHtml(label)}</span>`, iconSize: [0, 0], iconAnchor: [0, 0] });
}

const MEETING_SVG = `
<svg viewBox="0 0 30 30" width="30" height="30" aria-hidden="true" focusable="false">
  <circle class="gn-pin-body" cx="15" cy="15" r="12" />
  <path class="gn-pin-mark" d="M10 11 a3 3 0 1 0 0.01 0 M20 11 a3 3 0 1 0 0.01 0 M6 23 q4 -6 8 0 M16 23 q4 -6 8 0" />
</svg>`;

/** The meeting point of an outing: a round pin with two figures. */
export const meetingIcon: Icon = markerIcon({
  className: 'gn-pin gn-pin-meeting',
  html: MEETING_SVG,
  iconSize: [30, 30],
  iconAnchor: [15, 15],
});
