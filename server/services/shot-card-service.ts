import { shotGearSchema } from '../../shared/schemas/gear';
import type { ShotCardFormat, ShotPlan, ShotPlanRequest } from '../../shared/schemas/shot-plan';
import { buildShotPlan, ShotPlanInputError } from '../../shared/shotplan/plan';
import { lineupTideStatus } from '../../shared/tide';
import { AppError, parseOrThrow } from '../errors';
import { FieldNoteModel } from '../models/field-note';
import type { UserModel } from '../models/user';
import { shotCardModel } from '../shotcard/card-model';
import { renderShotCardHtml } from '../shotcard/render-html';
import { renderShotCardPdf } from '../shotcard/render-pdf';
import type { GearService } from './gear-service';
import { resolveTarget } from './lineup-service';
import type { SightlineService } from './sightline-service';
import type { TideService } from './tide-service';

/** Tide times read either side of the lineup, ms (as the lineup search reads them). */
const TIDE_MARGIN_MS = 24 * 3_600_000;
/** Field notes that bear on safety go on the card, newest first, at most this many. */
const MAX_CARD_NOTES = 6;

/** A rendered shot card. */
export interface ShotCardFile {
  contentType: string;
  filename: string;
  body: string | Buffer;
}

/** A file name fit for a download: letters, digits and dashes. */
function slug(text: string): string {
  return text.normalize('NFKD').replace(/[^\w\s-]/g, '').trim().replace(/[\s_]+/g, '-').toLowerCase().slice(0, 60) || 'sightline';
}

/**
 * Shot plans and shot cards of a lineup on a sightline the user may read, with a body and lens from
 * the user's own gear. The tide status comes from the sightline's tide rule and stored tide times
 * (as the lineup search computes it), never from the request.
 */
export class ShotCardService {
  constructor(
    private readonly sightlines: SightlineService,
    private readonly tides: TideService,
    private readonly gear: GearService,
    private readonly clock: () => Date = () => new Date(),
  ) {}

  async plan(user: UserModel, sightlineId: string, request: ShotPlanRequest): Promise<ShotPlan> {
    const saved = await this.sightlines.get(user, sightlineId, 'read');
    const sightline = saved.toPublic();
    const target = resolveTarget(request.target ?? { id: sightline.targetId });
    const [body, lens, settings] = await Promise.all([
      this.gear.body(user, request.bodyId),
      this.gear.lens(user, request.lensId),
      this.gear.settings(user),
    ]);
    parseOrThrow(shotGearSchema, {
      body: body.toBody(),
      lens: lens.toLens(),
      focalLengthMm: request.focalLengthMm,
      fNumber: request.fNumber,
      tracked: request.tracked,
    });

    const { start, peak, end } = request.lineup;
    let tide: { status: 'reachable' | 'cut-off' | 'unknown'; cutOffAt: Date | null } | null = null;
    if (sightline.tideRule) {
      const events = await this.tides.eventsUnchecked(sightline.id, { from: new Date(start.getTime() - TIDE_MARGIN_MS), to: new Date(end.getTime() + TIDE_MARGIN_MS) });
      const status = lineupTideStatus(sightline.tideRule, events, start, end);
      tide = { status: status.status, cutOffAt: status.cutOffAt };
    }
    const notes = await FieldNoteModel.findAll({
      where: { sightlineId: sightline.id, kind: ['hazard', 'tide', 'access'] },
      order: [['createdAt', 'DESC']],
      limit: MAX_CARD_NOTES,
    });

    try {
      return buildShotPlan({
        sightline: { id: sightline.id, name: sightline.name, timezone: sightline.timezone, vantage: sightline.vantage, landmark: sightline.landmark, hasTideRule: sightline.tideRule !== null },
        target,
        lineup: { start, peak, end },
        body: { id: body.id, ...body.toBody() },
        lens: { id: lens.id, ...lens.toLens() },
        ...(request.focalLengthMm !== undefined ? { focalLengthMm: request.focalLengthMm } : {}),
        ...(request.fNumber !== undefined ? { fNumber: request.fNumber } : {}),
        tracked: request.tracked,
        starTrackerAvailable: settings.starTrackerAvailable,
        sky: request.sky,
        foreground: request.foreground,
        panorama: request.panorama,
        ...(request.startAt ? { startAt: request.startAt } : {}),
        blockGapS: request.blockGapS,
        tide,
        fieldNotes: notes.map((n) => ({ kind: n.kind, body: n.body })),
        now: this.clock(),
      });
    } catch (error) {
      if (error instanceof ShotPlanInputError) throw new AppError('validation', error.message, { [error.field]: error.message });
      if (error instanceof RangeError) throw new AppError('validation', error.message);
      throw error;
    }
  }

  /** The plan rendered as the printable HTML page or the PDF. */
  async card(user: UserModel, sightlineId: string, request: ShotPlanRequest, format: ShotCardFormat): Promise<ShotCardFile> {
    const plan = await this.plan(user, sightlineId, request);
    const model = shotCardModel(plan);
    const base = `shot-card-${slug(plan.sightline.name)}-${plan.night}`;
    if (format === 'pdf') return { contentType: 'application/pdf', filename: `${base}.pdf`, body: await renderShotCardPdf(model) };
    return { contentType: 'text/html; charset=utf-8', filename: `${base}.html`, body: renderShotCardHtml(model) };
  }
}
