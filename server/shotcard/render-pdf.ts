/**
 * The shot card as a one-page A4 PDF (pdfkit), drawn from the same model as the HTML page: the
 * timeline bar and the bearing sketch as vector graphics, the sections in two columns, the
 * cautions across the page. Text is set in Inter from @fontsource/inter: pdfkit reads its WOFF
 * files through fontkit, and each run of text takes the Inter subset (latin, latin-ext, greek,
 * cyrillic, vietnamese) that holds its characters.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import PDFDocument from 'pdfkit';
import { timelineBarLayout } from '../../shared/shotplan/sketch';
import { barHours, type CardRow, type CardSection, type ShotCardModel } from './card-model';

type Doc = InstanceType<typeof PDFDocument>;
type Weight = 400 | 600;

const require = createRequire(import.meta.url);

/** Inter subsets in the order a character is looked up (latin first). */
const SUBSETS = ['latin', 'latin-ext', 'vietnamese', 'greek', 'greek-ext', 'cyrillic', 'cyrillic-ext'] as const;
type Subset = (typeof SUBSETS)[number];

interface FontFiles {
  ranges: Map<Subset, Array<[number, number]>>;
  files: Map<string, Buffer>;
}

let fontFiles: FontFiles | null = null;

function parseRanges(text: string): Array<[number, number]> {
  return text.split(',').map((part) => {
    const [a, b] = part.trim().replace(/^U\+/i, '').split('-');
    const lo = Number.parseInt(a ?? '', 16);
    return [lo, b ? Number.parseInt(b, 16) : lo] as [number, number];
  });
}

/** Reads the WOFF files and the subsets' Unicode ranges once per process. */
function loadFonts(): FontFiles {
  if (fontFiles) return fontFiles;
  const unicode = JSON.parse(readFileSync(require.resolve('@fontsource/inter/unicode.json'), 'utf8')) as Record<string, string>;
  const ranges = new Map<Subset, Array<[number, number]>>();
  const files = new Map<string, Buffer>();
  for (const subset of SUBSETS) {
    const r = unicode[subset];
    if (!r) continue;
    ranges.set(subset, parseRanges(r));
    for (const weight of [400, 600] as const) {
      files.set(`${subset}-${weight}`, readFileSync(require.resolve(`@fontsource/inter/files/inter-${subset}-${weight}-normal.woff`)));
    }
  }
  fontFiles = { ranges, files };
  return fontFiles;
}

function subsetOf(codePoint: number, fonts: FontFiles): Subset {
  for (const subset of SUBSETS) {
    const r = fonts.ranges.get(subset);
    if (r?.some(([lo, hi]) => codePoint >= lo && codePoint <= hi)) return subset;
  }
  return 'latin';
}

/** Splits text into runs that one subset can set, spaces and digits staying with the run they are in. */
function runs(text: string, fonts: FontFiles): Array<{ subset: Subset; text: string }> {
  const out: Array<{ subset: Subset; text: string }> = [];
  for (const ch of text) {
    const cp = ch.codePointAt(0) ?? 32;
    const neutral = cp < 0x80 && !/[A-Za-z]/.test(ch);
    const previous = out[out.length - 1];
    const subset = neutral && previous ? previous.subset : subsetOf(cp, fonts);
    if (previous && previous.subset === subset) previous.text += ch;
    else out.push({ subset, text: ch });
  }
  return out;
}

const COLOURS = { text: '#111111', dim: '#555555', line: '#bbbbbb', warn: '#b00000', accent: '#8a5a00', sky: '#d9c089', pano: '#c9a24b', fg: '#9fb3c8', track: '#e4e4e4' };

interface TextOptions {
  width: number;
  weight?: Weight;
  size?: number;
  colour?: string;
  align?: 'left' | 'center' | 'right';
}

class CardWriter {
  constructor(readonly doc: Doc, private readonly fonts: FontFiles) {
    for (const key of fonts.files.keys()) doc.registerFont(`inter-${key}`, fonts.files.get(key)!);
  }

  private font(subset: Subset, weight: Weight): string {
    return `inter-${subset}-${weight}`;
  }

  /** Height the text takes in a column (measured in the latin face). */
  height(text: string, o: TextOptions): number {
    this.doc.font(this.font('latin', o.weight ?? 400)).fontSize(o.size ?? 8);
    return this.doc.heightOfString(text, { width: o.width, lineGap: 1 });
  }

  /** Writes text at (x, y), switching subset fonts along the way; returns the height used. */
  text(text: string, x: number, y: number, o: TextOptions): number {
    const weight = o.weight ?? 400;
    const h = this.height(text, o);
    const parts = runs(text, this.fonts);
    this.doc.fillColor(o.colour ?? COLOURS.text).fontSize(o.size ?? 8);
    parts.forEach((part, i) => {
      this.doc.font(this.font(part.subset, weight));
      const options = { width: o.width, lineGap: 1, align: o.align ?? 'left', continued: i < parts.length - 1 };
      if (i === 0) this.doc.text(part.text, x, y, options);
      else this.doc.text(part.text, options);
    });
    return h;
  }
}

const PAGE = { width: 595.28, height: 841.89, margin: 28 };
const GAP = 14;
const LABEL_SHARE = 0.36;

function rowHeight(w: CardWriter, row: CardRow, width: number): number {
  const lw = width * LABEL_SHARE;
  return Math.max(w.height(row.label, { width: lw - 4 }), w.height(row.value, { width: width - lw, weight: row.warn ? 600 : 400 })) + 1.5;
}

function drawSection(w: CardWriter, s: CardSection, x: number, y: number, width: number, topExtra = 0): number {
  const doc = w.doc;
  w.text(s.title.toUpperCase(), x, y, { width, weight: 600, size: 8.5, colour: COLOURS.accent });
  let cy = y + 14 + topExtra;
  const lw = width * LABEL_SHARE;
  for (const r of s.rows) {
    const h = rowHeight(w, r, width);
    w.text(r.label, x, cy, { width: lw - 4, colour: r.warn ? COLOURS.warn : COLOURS.dim });
    w.text(r.value, x + lw, cy, { width: width - lw, weight: r.warn ? 600 : 400, colour: r.warn ? COLOURS.warn : COLOURS.text });
    cy += h;
  }
  for (const l of s.lines ?? []) cy += w.text(`• ${l}`, x, cy, { width }) + 1;
  doc.moveTo(x, cy + 3).lineTo(x + width, cy + 3).lineWidth(0.5).strokeColor(COLOURS.line).stroke();
  return cy + 8 - y;
}

function polar(cx: number, cy: number, r: number, bearingDeg: number): [number, number] {
  const a = (bearingDeg * Math.PI) / 180;
  return [cx + r * Math.sin(a), cy - r * Math.cos(a)];
}

/** The map snippet as vector graphics, size x size points with its top-left at (x, y). */
function drawBearing(w: CardWriter, model: ShotCardModel, x: number, y: number, size: number): void {
  const doc = w.doc;
  const c: [number, number] = [x + size / 2, y + size / 2];
  const r = size / 2 - 8;
  doc.save();
  doc.circle(c[0], c[1], r).lineWidth(1).strokeColor(COLOURS.line).stroke();
  for (let i = 0; i < 12; i++) {
    const [x0, y0] = polar(c[0], c[1], r, i * 30);
    const [x1, y1] = polar(c[0], c[1], r - (i % 3 === 0 ? 6 : 3), i * 30);
    doc.moveTo(x0, y0).lineTo(x1, y1).lineWidth(0.8).strokeColor(COLOURS.dim).stroke();
  }
  doc.moveTo(c[0], c[1]).lineTo(c[0], c[1] - r).lineWidth(1).strokeColor(COLOURS.text).stroke();
  const [mx, my] = polar(c[0], c[1], r - 3, model.sketch.declinationDeg);
  doc.moveTo(c[0], c[1]).lineTo(mx, my).dash(3, { space: 2 }).strokeColor(COLOURS.dim).stroke().undash();
  const [lx, ly] = polar(c[0], c[1], r - 8, model.sketch.trueDeg);
  doc.moveTo(c[0], c[1]).lineTo(lx, ly).lineWidth(2.2).strokeColor(COLOURS.accent).stroke();
  doc.circle(lx, ly, 3.2).fill(COLOURS.accent);
  doc.circle(c[0], c[1], 2.6).fill(COLOURS.text);
  doc.restore();
  w.text('N', c[0] - 10, y - 2, { width: 20, weight: 600, size: 8, align: 'center' });
  w.text('MN', mx + 2, my + 2, { width: 20, size: 6, colour: COLOURS.dim });
}

/** Label lanes of the bar: two above it, two below. */
const BAR_LABEL_SIZE = 6.5;

/** The timeline bar across the page, labels spread over four lanes; returns its height. */
function drawBar(w: CardWriter, model: ShotCardModel, x: number, y: number, width: number): number {
  const doc = w.doc;
  const labels = model.barEventLabels;
  doc.font('inter-latin-400').fontSize(BAR_LABEL_SIZE);
  const widths = labels.map((l) => doc.widthOfString(l));
  const bar = timelineBarLayout(model.bar.events, model.bar.blocks, width, { labelWidths: widths, lanes: 4, labelGap: 4, dropOverflow: true });
  const top = y + 20;
  const laneY = [y + 9, y, top + 27, top + 35];
  doc.save();
  doc.rect(x, top + 3, width, 10).fill(COLOURS.track);
  for (const b of bar.blocks) {
    const colour = b.late ? COLOURS.warn : b.kind === 'sky-stack' ? COLOURS.sky : b.kind === 'panorama-row' ? COLOURS.pano : COLOURS.fg;
    doc.rect(x + b.x, top, Math.max(1, b.w), 16).fill(colour);
  }
  for (const ev of bar.events) {
    const deadline = ev.kind === 'tide-cut-off' || ev.kind === 'moonrise' || ev.kind === 'astronomical-dawn' || ev.kind === 'lineup-end';
    doc.moveTo(x + ev.x, top - 2).lineTo(x + ev.x, top + 18).lineWidth(1).strokeColor(deadline ? COLOURS.warn : COLOURS.text).stroke();
  }
  for (const h of barHours(bar.startMs, bar.endMs, model.bar.timeZone)) {
    const hx = x + ((h.atMs - bar.startMs) / (bar.endMs - bar.startMs)) * width;
    doc.moveTo(hx, top + 16).lineTo(hx, top + 19).lineWidth(0.5).strokeColor(COLOURS.dim).stroke();
  }
  doc.restore();
  for (const h of barHours(bar.startMs, bar.endMs, model.bar.timeZone)) {
    const hx = x + ((h.atMs - bar.startMs) / (bar.endMs - bar.startMs)) * width;
    w.text(h.label, hx - 12, top + 19.5, { width: 24, size: 5.5, align: 'center', colour: COLOURS.dim });
  }
  bar.events.forEach((ev, i) => {
    if (ev.lane < 0) return;
    const deadline = ev.kind === 'tide-cut-off' || ev.kind === 'moonrise';
    w.text(labels[i] ?? ev.label, x + ev.labelX, laneY[ev.lane] ?? y, { width: (widths[i] ?? 40) + 4, size: BAR_LABEL_SIZE, colour: deadline ? COLOURS.warn : COLOURS.text });
  });
  const lowest = Math.max(...bar.events.map((ev) => ev.lane));
  return top + (lowest >= 3 ? 45 : lowest >= 2 ? 37 : 28) - y;
}

/**
 * The shot card PDF.
 * @param model - from shotCardModel
 * @returns the PDF file's bytes
 */
export async function renderShotCardPdf(model: ShotCardModel): Promise<Buffer> {
  const doc = new PDFDocument({ size: 'A4', margin: PAGE.margin, info: { Title: model.title, Author: 'Gnomon', Subject: model.subtitle } });
  const chunks: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => chunks.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(chunks)));
    doc.on('error', reject);
  });

  const w = new CardWriter(doc, loadFonts());
  const left = PAGE.margin;
  const full = PAGE.width - 2 * PAGE.margin;
  const col = (full - GAP) / 2;
  let y = PAGE.margin;

  y += w.text(model.title, left, y, { width: full, weight: 600, size: 15 }) + 1;
  y += w.text(model.subtitle, left, y, { width: full, size: 9.5 }) + 2;
  y += w.text(model.headline, left, y, { width: full, weight: 600, size: 11 }) + 1;
  y += w.text(model.zoneLine, left, y, { width: full, size: 8, colour: COLOURS.dim }) + 8;
  y += drawBar(w, model, left, y, full) + 6;

  if (model.warnings.length) {
    y += w.text('RUNS PAST A DEADLINE', left, y, { width: full, weight: 600, size: 8.5, colour: COLOURS.warn }) + 1;
    for (const warning of model.warnings) y += w.text(`• ${warning}`, left, y, { width: full, weight: 600, colour: COLOURS.warn }) + 1;
    y += 6;
  }

  // Two columns: the map snippet and the where, then each section into the shorter column.
  const sketchSize = 84;
  const byId = new Map(model.sections.map((s) => [s.id, s]));
  const where = byId.get('where');
  const columns = [y, y];
  if (where) {
    drawBearing(w, model, left + col - sketchSize, y, sketchSize);
    const h = Math.max(drawSection(w, where, left, y, col - sketchSize - 6), sketchSize + 6);
    columns[0] = y + h;
  }
  for (const s of model.sections) {
    if (s.id === 'where') continue;
    const i = columns[0]! <= columns[1]! ? 0 : 1;
    const x = i === 0 ? left : left + col + GAP;
    columns[i] = columns[i]! + drawSection(w, s, x, columns[i]!, col);
  }
  y = Math.max(...columns) + 4;

  if (model.fieldNotes.length) {
    y += w.text('FIELD NOTES', left, y, { width: full, weight: 600, size: 8.5, colour: COLOURS.accent }) + 1;
    for (const n of model.fieldNotes) y += w.text(`• ${n.kind}: ${n.body}`, left, y, { width: full }) + 1;
    y += 5;
  }
  y += w.text('CAUTIONS', left, y, { width: full, weight: 600, size: 8.5, colour: COLOURS.accent }) + 1;
  for (const c of model.cautions) y += w.text(`• ${c}`, left, y, { width: full, size: 7.5 }) + 1;
  y += 5;
  w.text(model.footer, left, y, { width: full, weight: 600, size: 8 });

  doc.end();
  return done;
}
