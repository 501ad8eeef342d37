import { computed, type Ref } from 'vue';
import { altAzView, landmarkSilhouette, linearScale, linearTicks, polylinePath, type NightChartSeries } from '../../shared/chart';
import type { SightlineGeometry } from '../../shared/geo';
import type { Frame } from '../../shared/schemas/geometry';
import type { Lineup } from '../../shared/schemas/lineup';

/** Everything the alt-az panel draws, in SVG user units (CSS px). */
export interface AltAzLayout {
  width: number;
  height: number;
  plot: { x: number; y: number; width: number; height: number };
  frameBox: { x: number; y: number; width: number; height: number };
  silhouette: string;
  groundY: number;
  horizonY: number;
  track: string[];
  lineupTrack: string[];
  hourMarks: Array<{ x: number; y: number; label: string }>;
  xTicks: Array<{ x: number; label: string }>;
  yTicks: Array<{ y: number; label: string }>;
}

function normalizeAz(deg: number): number {
  return ((deg % 360) + 360) % 360;
}

/**
 * Lays out the altitude-against-azimuth panel: the frame as a box, the landmark's silhouette, the
 * target's track with hour marks, and the stretches of the night's lineups on the track. Azimuth
 * grows to the right, as the sky looks when facing the landmark.
 */
export function useNightChartAltAz(
  series: Ref<NightChartSeries | null>,
  width: Ref<number>,
  frame: Ref<Frame | null>,
  geometry: Ref<SightlineGeometry | null>,
  nightLineups: Ref<readonly Lineup[]>,
) {
  return computed<AltAzLayout | null>(() => {
    const s = series.value;
    const f = frame.value;
    const g = geometry.value;
    if (!s || !f) return null;
    const baseDeg = g?.baseElevationDeg ?? f.bottomAltDeg;
    const view = altAzView(s, f, { landmarkBaseDeg: baseDeg });
    const w = width.value;
    const height = w < 560 ? 260 : 300;
    const pad = { left: 38, right: 10, top: 12, bottom: 28 };
    const plot = { x: pad.left, y: pad.top, width: w - pad.left - pad.right, height: height - pad.top - pad.bottom };
    const x = linearScale([-view.halfSpanDeg, view.halfSpanDeg], [plot.x, plot.x + plot.width]);
    const y = linearScale(view.altDomainDeg, [plot.y + plot.height, plot.y]);
    const map = (offset: number, alt: number): [number, number] => [x.map(offset), y.map(alt)];

    const inLineup = (ms: number) => nightLineups.value.some((l) => ms >= Date.parse(l.start) && ms <= Date.parse(l.end));
    const lineupTrack: string[] = [];
    for (const piece of view.track) {
      let run: Array<[number, number]> = [];
      for (const p of piece) {
        if (inLineup(p.atMs)) run.push(map(p.offsetDeg, p.altDeg));
        else if (run.length) {
          lineupTrack.push(polylinePath(run.length === 1 ? [run[0]!, run[0]!] : run));
          run = [];
        }
      }
      if (run.length) lineupTrack.push(polylinePath(run.length === 1 ? [run[0]!, run[0]!] : run));
    }

    const outline = g ? landmarkSilhouette(g.angularWidthDeg, baseDeg, g.topElevationDeg) : landmarkSilhouette(f.halfWidthDeg * 2, baseDeg, f.bottomAltDeg);
    const maxTicks = w < 560 ? 5 : 10;
    return {
      width: w,
      height,
      plot,
      frameBox: {
        x: x.map(-f.halfWidthDeg),
        y: y.map(f.topAltDeg),
        width: Math.max(x.map(f.halfWidthDeg) - x.map(-f.halfWidthDeg), 2),
        height: y.map(f.bottomAltDeg) - y.map(f.topAltDeg),
      },
      silhouette: polylinePath(outline.map(([o, a]) => map(o, a)), true),
      groundY: y.map(baseDeg),
      horizonY: y.map(0),
      track: view.track.map((piece) => polylinePath(piece.map((p) => map(p.offsetDeg, p.altDeg)))),
      lineupTrack,
      hourMarks: view.hourMarks.map((m) => ({ x: x.map(m.offsetDeg), y: y.map(m.altDeg), label: m.label })),
      // Round azimuths (unwrapped around the centre, labelled 0..360).
      xTicks: linearTicks(view.centreAzDeg - view.halfSpanDeg, view.centreAzDeg + view.halfSpanDeg, maxTicks)
        .map((az) => ({ x: x.map(az - view.centreAzDeg), label: `${Math.round(normalizeAz(az))}°` })),
      yTicks: linearTicks(view.altDomainDeg[0], view.altDomainDeg[1], 6).map((a) => ({ y: y.map(a), label: `${a}°` })),
    };
  });
}
