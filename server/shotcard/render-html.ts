/**
 * The shot card as one self-contained HTML page: no scripts, no external files (the map snippet
 * and the timeline are inline SVG), one column on a phone, two on a wide screen, one A4 page in
 * print. On a screen in dark mode it turns red on black, as the app's night-vision theme does.
 */
import { timelineBarLayout } from '../../shared/shotplan/sketch';
import { barHours, type CardSection, type ShotCardModel } from './card-model';
import { escapeHtml } from '../../shared/html';

const e = escapeHtml;

/** Point at a bearing (deg, clockwise from north) and radius from (cx, cy), SVG y down. */
function polar(cx: number, cy: number, r: number, bearingDeg: number): [number, number] {
  const a = (bearingDeg * Math.PI) / 180;
  return [cx + r * Math.sin(a), cy - r * Math.cos(a)];
}

const f1 = (n: number) => n.toFixed(1);

/** The map snippet: north up, vantage in the middle, the sightline to the landmark, magnetic north dashed. */
export function bearingSvg(model: ShotCardModel): string {
  const { trueDeg, declinationDeg } = model.sketch;
  const c = 90;
  const r = 70;
  const ticks = Array.from({ length: 12 }, (_, i) => {
    const [x0, y0] = polar(c, c, r, i * 30);
    const [x1, y1] = polar(c, c, r - (i % 3 === 0 ? 9 : 5), i * 30);
    return `<line class="tick" x1="${f1(x0)}" y1="${f1(y0)}" x2="${f1(x1)}" y2="${f1(y1)}"/>`;
  }).join('');
  const [lx, ly] = polar(c, c, r - 12, trueDeg);
  const [mx, my] = polar(c, c, r - 4, declinationDeg);
  return `<svg class="bearing" viewBox="0 0 180 180" role="img" aria-label="Sketch: the landmark lies ${e(model.sketch.distanceText)} away at a true bearing of ${f1(trueDeg)} degrees">
<circle class="ring" cx="${c}" cy="${c}" r="${r}"/>${ticks}
<line class="north" x1="${c}" y1="${c}" x2="${c}" y2="${c - r}"/><text class="label" x="${c}" y="${c - r - 6}" text-anchor="middle">N</text>
<line class="magnetic" x1="${c}" y1="${c}" x2="${f1(mx)}" y2="${f1(my)}"/><text class="small" x="${f1(mx + 4)}" y="${f1(my + 12)}">MN</text>
<line class="sight" x1="${c}" y1="${c}" x2="${f1(lx)}" y2="${f1(ly)}"/>
<circle class="landmark" cx="${f1(lx)}" cy="${f1(ly)}" r="5"/>
<circle class="vantage" cx="${c}" cy="${c}" r="4"/>
</svg>`;
}

/** Bar units across (the SVG stretches to the page width). */
const BAR_UNITS = 1000;
/** Bar units a label character takes, for an 11 px label on a bar about 680 px wide. */
const UNITS_PER_CHAR = 9.5;
/** Label lanes: two above the bar, two below. */
const LANE_TOP = ['0px', '15px', '', ''];
const LANE_BOTTOM = ['', '', '0px', '15px'];

/**
 * The night's timeline: the bar (blocks as boxes, late ones red, events as ticks) as an SVG that
 * stretches to the width, with the labels and hours as HTML placed by percent so text never
 * stretches; labels spread over four lanes so they do not overlap (one with no room is left out:
 * the times table lists every event).
 */
export function timelineHtml(model: ShotCardModel): string {
  const labels = model.barEventLabels;
  const bar = timelineBarLayout(model.bar.events, model.bar.blocks, BAR_UNITS, { labelWidths: labels.map((l) => l.length * UNITS_PER_CHAR), lanes: 4, labelGap: 10, dropOverflow: true });
  const pct = (x: number) => `${((x / BAR_UNITS) * 100).toFixed(2)}%`;
  const blocks = bar.blocks.map((b) =>
    `<rect class="block block-${e(b.kind)}${b.late ? ' late' : ''}" x="${f1(b.x)}" y="2" width="${f1(b.w)}" height="22"><title>${e(b.label)}</title></rect>`,
  ).join('');
  const ticks = bar.events.map((ev) => `<line class="event event-${e(ev.kind)}" x1="${f1(ev.x)}" y1="0" x2="${f1(ev.x)}" y2="26" vector-effect="non-scaling-stroke"/>`).join('');
  const eventLabels = bar.events.map((ev, i) => {
    if (ev.lane < 0) return '';
    const deadline = ev.kind === 'tide-cut-off' || ev.kind === 'moonrise' || ev.kind === 'astronomical-dawn' || ev.kind === 'lineup-end';
    const vertical = ev.lane < 2 ? `bottom:${LANE_TOP[ev.lane]}` : `top:${LANE_BOTTOM[ev.lane]}`;
    return `<span class="bar-label${deadline ? ' deadline' : ''}" style="left:${pct(ev.labelX)};${vertical}">${e(labels[i] ?? ev.label)}</span>`;
  });
  const hours = barHours(bar.startMs, bar.endMs, model.bar.timeZone).map((h) => {
    const x = ((h.atMs - bar.startMs) / (bar.endMs - bar.startMs)) * BAR_UNITS;
    return `<span class="hour" style="left:${pct(x)}">${e(h.label)}</span>`;
  }).join('');
  const above = eventLabels.filter((_, i) => (bar.events[i]?.lane ?? -1) >= 0 && (bar.events[i]?.lane ?? 0) < 2).join('');
  const below = eventLabels.filter((_, i) => (bar.events[i]?.lane ?? 0) >= 2).join('');
  return `<div class="timeline" role="img" aria-label="The night's timeline">
<div class="lanes above">${above}</div>
<svg class="bar" viewBox="0 0 ${BAR_UNITS} 26" preserveAspectRatio="none"><rect class="track" x="0" y="6" width="${BAR_UNITS}" height="14"/>${blocks}${ticks}</svg>
<div class="hours">${hours}</div>
<div class="lanes below">${below}</div>
</div>`;
}

function section(s: CardSection): string {
  const rows = s.rows.map((r) => `<tr${r.warn ? ' class="warn"' : ''}><th scope="row">${e(r.label)}</th><td>${e(r.value)}</td></tr>`).join('');
  const lines = (s.lines ?? []).map((l) => `<li>${e(l)}</li>`).join('');
  return `<section class="box" id="${s.id}"><h2>${e(s.title)}</h2>${rows ? `<table>${rows}</table>` : ''}${lines ? `<ul>${lines}</ul>` : ''}</section>`;
}

const STYLE = `
:root { --bg: #ffffff; --text: #111111; --dim: #555555; --line: #cccccc; --warn: #b00000; --accent: #8a5a00; --block: #d9c089; --fg: #9fb3c8; --pano: #c9a24b; }
@media screen and (prefers-color-scheme: dark) {
  :root { --bg: #000000; --text: #e0442f; --dim: #a8301f; --line: #3a120c; --warn: #ff2a12; --accent: #e0442f; --block: #5c1409; --fg: #3a0c05; --pano: #8f2c19; }
}
* { box-sizing: border-box; }
body { margin: 0; padding: 14px; background: var(--bg); color: var(--text); font: 13px/1.4 Inter, system-ui, -apple-system, "Segoe UI", sans-serif; }
main { max-width: 980px; margin: 0 auto; }
h1 { font-size: 19px; margin: 0; }
h2 { font-size: 13px; margin: 0 0 4px; text-transform: uppercase; letter-spacing: 0.04em; color: var(--accent); }
p { margin: 2px 0; }
.dim { color: var(--dim); }
.headline { font-size: 15px; font-weight: 600; margin: 6px 0; }
.grid { display: grid; gap: 10px; grid-template-columns: 1fr; }
@media (min-width: 720px) { .grid { grid-template-columns: 1fr 1fr; } }
.box { border: 1px solid var(--line); border-radius: 6px; padding: 8px 10px; break-inside: avoid; }
table { border-collapse: collapse; width: 100%; }
th { text-align: left; font-weight: 500; color: var(--dim); padding: 1px 8px 1px 0; vertical-align: top; width: 40%; }
td { padding: 1px 0; font-variant-numeric: tabular-nums; }
tr.warn th, tr.warn td { color: var(--warn); font-weight: 600; }
ul { margin: 4px 0 0; padding-left: 18px; }
.where { display: flex; gap: 10px; align-items: flex-start; flex-wrap: wrap; }
.where table { flex: 1 1 220px; }
svg.bearing { width: 150px; height: 150px; flex: none; }
svg text { fill: var(--text); font: inherit; }
.ring { fill: none; stroke: var(--line); stroke-width: 1.5; }
.tick { stroke: var(--dim); stroke-width: 1.2; }
.north { stroke: var(--text); stroke-width: 1.5; }
.magnetic { stroke: var(--dim); stroke-width: 1.5; stroke-dasharray: 4 3; }
.sight { stroke: var(--accent); stroke-width: 3; }
.landmark { fill: var(--accent); }
.vantage { fill: var(--text); }
.label { font-size: 14px; font-weight: 700; }
.small { font-size: 11px; }
.timeline { margin-top: 4px; }
.lanes { position: relative; height: 30px; }
.bar-label { position: absolute; white-space: nowrap; font-size: 11px; line-height: 14px; font-variant-numeric: tabular-nums; }
.bar-label.deadline { color: var(--warn); font-weight: 600; }
svg.bar { width: 100%; height: 26px; display: block; }
.hours { position: relative; height: 14px; border-top: 1px solid var(--line); }
.hour { position: absolute; transform: translateX(-50%); font-size: 10px; color: var(--dim); }
.track { fill: var(--line); }
.block { stroke: var(--bg); stroke-width: 1; }
.block-sky-stack { fill: var(--block); }
.block-panorama-row { fill: var(--pano); }
.block-foreground { fill: var(--fg); }
.block.late { fill: var(--warn); }
.event { stroke: var(--text); stroke-width: 1.5; }
.event-tide-cut-off, .event-moonrise, .event-astronomical-dawn, .event-lineup-end { stroke: var(--warn); }
.warnings { color: var(--warn); font-weight: 600; }
.cautions li, .notes li { margin-bottom: 2px; }
footer { margin-top: 10px; font-size: 12px; color: var(--dim); }
@page { size: A4; margin: 10mm; }
@media print {
  body { padding: 0; font-size: 9.5pt; }
  .grid { grid-template-columns: 1fr 1fr; gap: 6px; }
  .box { padding: 4px 6px; }
  svg.bearing { width: 110px; height: 110px; }
}
`;

/**
 * The shot card page.
 * @param model - from shotCardModel
 * @returns a complete HTML document (UTF-8)
 */
export function renderShotCardHtml(model: ShotCardModel): string {
  const byId = new Map(model.sections.map((s) => [s.id, s]));
  const where = byId.get('where');
  const others = model.sections.filter((s) => s.id !== 'where' && s.id !== 'timeline');
  const timeline = byId.get('timeline');
  const whereBox = where
    ? `<section class="box" id="where"><h2>${e(where.title)}</h2><div class="where">${bearingSvg(model)}<table>${where.rows.map((r) => `<tr${r.warn ? ' class="warn"' : ''}><th scope="row">${e(r.label)}</th><td>${e(r.value)}</td></tr>`).join('')}</table></div></section>`
    : '';
  const warnings = model.warnings.length
    ? `<section class="box warnings" id="warnings"><h2>Runs past a deadline</h2><ul>${model.warnings.map((w) => `<li>${e(w)}</li>`).join('')}</ul></section>`
    : '';
  const notes = model.fieldNotes.length
    ? `<section class="box notes" id="field-notes"><h2>Field notes</h2><ul>${model.fieldNotes.map((n) => `<li><strong>${e(n.kind)}:</strong> ${e(n.body)}</li>`).join('')}</ul></section>`
    : '';
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="color-scheme" content="light dark">
<title>${e(model.title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<header>
<h1>${e(model.title)}</h1>
<p>${e(model.subtitle)}</p>
<p class="headline" data-testid="shot-card-headline">${e(model.headline)}</p>
<p class="dim">${e(model.zoneLine)}</p>
</header>
<section class="box" id="night"><h2>The night</h2>${timelineHtml(model)}</section>
${warnings}
<div class="grid">
${whereBox}
${others.map(section).join('\n')}
${timeline ? section(timeline) : ''}
</div>
${notes}
<section class="box cautions" id="cautions"><h2>Cautions</h2><ul>${model.cautions.map((c) => `<li>${e(c)}</li>`).join('')}</ul></section>
<footer><strong>${e(model.footer)}</strong></footer>
</main>
</body>
</html>
`;
}
