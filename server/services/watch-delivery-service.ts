/**
 * The e-mails of watches: the scan that records which are due, and the send step.
 *
 * Exactly once. Each e-mail is one row of watch_deliveries, unique on (watch, lineup start, lead
 * time); the scan inserts it with ON CONFLICT DO NOTHING, so scans that overlap, repeat or run in
 * two app copies record it once. The send step
 *   1. claims the row in a transaction: pending -> sending, with a fresh claim token (a row whose
 *      claim is older than the lease counts as abandoned and may be claimed again);
 *   2. sends it over SMTP;
 *   3. marks it sent, only if the claim token is still its own.
 * A second sender finds the row claimed or sent and does nothing. A crash between 1 and 3 leaves
 * the row "sending"; once the lease has passed the next scan hands it to a sender again, which sends
 * it. An SMTP failure puts the row back to pending and the job queue retries with back-off.
 *
 * What is left is at-least-once, not exactly-once, in one case: the SMTP server accepted the
 * message and the process died (or lost the database) before step 3. The e-mail is then sent again
 * after the lease, with the same Message-ID (derived from the row's unique key), so the copy is
 * visible as a duplicate and mail programs that remove duplicates by Message-ID drop it.
 *
 * The sky outlook (see shared/outlook/watch.ts, watchOutlookDecision):
 * - Every e-mail shows the outlook of its lineup window (badge, mean cloud, dew risk, when the
 *   forecast was made), as the forecast service gives it at sending time, and keeps it in the
 *   delivery's `outlook` column.
 * - A watch with a cloud limit (maxCloudPct) is judged when the scan would record the e-mail:
 *   cloudier than the limit, nothing is recorded, and each later scan asks again while that lead
 *   time is current (a sky that clears a day later still gets its reminder, late). Without a
 *   usable forecast (beyond the horizon, the service down, slow or not set up) the e-mail goes
 *   anyway and says the outlook is unknown: a forecast failure never holds back or breaks a mail.
 * - The send step judges again with the outlook it puts in the e-mail. If the sky clouded over in
 *   between (a retry hours later), the row is withdrawn (deleted: no e-mail went out, so nothing
 *   can be sent twice) and a later scan may record it again.
 * - "Still clear?": the on-the-day e-mail (lead 0) compares its outlook with the one in the last
 *   e-mail sent for the same lineup. When it changed a lot, the subject and the text say so, and a
 *   cloud limit does not hold that e-mail back. It is the lead-0 delivery itself, under the same
 *   unique key, not an extra e-mail: one e-mail per lineup and lead time, as before.
 */
import { randomUUID } from 'node:crypto';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Lineup } from '../../shared/schemas/lineup';
import { skyOutlookSchema, type SkyOutlook } from '../../shared/schemas/outlook';
import { unavailableOutlooks, watchOutlookDecision, type TimeWindow, type WatchOutlookDecision } from '../../shared/outlook';
import { AppError } from '../errors';
import { FieldNoteModel } from '../models/field-note';
import { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import { WatchModel } from '../models/watch';
import { WatchDeliveryModel, type DeliverySnapshot } from '../models/watch-delivery';
import type { Mailer } from '../mail/mailer';
import { renderWatchEmail, type WatchEmailCaution, type WatchEmailOutlook } from '../mail/watch-email';
import { watchedLineupsToIcs } from '../mail/watch-ics';
import type { UnsubscribeTokens } from './unsubscribe-tokens';
import type { WatchLineups } from './watch-lineups';
import { currentLead, deliveryLineupStart, nightOf, scanRange } from './watch-timing';

export interface DeliverySettings {
  mailFrom: string;
  /** Public address of the app, no trailing slash. */
  appUrl: string;
  /** Attempts before a delivery is given up ('failed'): the queue's retries + 1. */
  maxAttempts: number;
  /** A claim older than this is abandoned (its sender died), ms; longer than any SMTP exchange. */
  claimLeaseMs: number;
  /** A pending row untouched this long has lost its job (e.g. a crash after the insert), ms. */
  orphanAfterMs: number;
}

export interface ScanResult {
  /** Deliveries to hand to a sender: new ones and abandoned ones. */
  toSend: string[];
  created: number;
  /** Watches whose search failed (logged; the others go on). */
  failedWatches: number;
  /** Due e-mails held back because the outlook is cloudier than the watch's limit (asked again next scan). */
  heldBackByCloud: number;
}

/** The sky outlook of lineup windows at a position (the ForecastService); never throws on a service failure. */
export interface OutlookSource {
  outlookFor(lat: number, lon: number, windows: readonly TimeWindow[]): Promise<SkyOutlook[]>;
}

/** An earlier e-mail of a lineup: when it went and the outlook it showed. */
interface EarlierMail {
  sentAt: Date;
  outlook: SkyOutlook;
}

export type SendOutcome = 'sent' | 'skipped' | 'failed' | 'not-claimed';

/** An SMTP failure worth retrying; the queue retries the job with back-off. */
export class RetryableSendError extends Error {
  override name = 'RetryableSendError';
}

/** Most field notes quoted in one e-mail, and the longest quote. */
const MAX_NOTES = 8;
const MAX_NOTE_CHARS = 600;
/** Lineups of one watch and lead this close are taken as the same lineup, minutes. */
const SAME_LINEUP_MINUTES = 30;
const NOTE_ORDER: Record<string, number> = { hazard: 0, tide: 1, access: 2, general: 3 };
/** Said in an outlook when no forecast service is given to the watches. */
const NO_FORECAST_MESSAGE = 'No forecast service is set up on this server';

function compactUtc(d: Date): string {
  return d.toISOString().slice(0, 16).replace(/[-:]/g, '');
}

/** Message-ID of a delivery, from its unique key: the same e-mail always carries the same one. */
export function deliveryMessageId(watchId: string, lineupStart: Date, leadDays: number): string {
  return `watch.${watchId}.${compactUtc(lineupStart)}.lead${leadDays}@gnomon.watches`;
}

function smtpResponseCode(error: unknown): number | undefined {
  const code = (error as { responseCode?: unknown } | null)?.responseCode;
  return typeof code === 'number' ? code : undefined;
}

function errorText(error: unknown): string {
  return (error instanceof Error ? error.message : String(error)).slice(0, 1000);
}

export class WatchDeliveryService {
  constructor(
    private readonly sequelize: Sequelize,
    private readonly finder: WatchLineups,
    private readonly mailer: Mailer,
    private readonly tokens: UnsubscribeTokens,
    private readonly settings: DeliverySettings,
    /** The sky outlook; without it every outlook is 'unavailable' and cloud limits never hold a mail back. */
    private readonly forecast: OutlookSource | null = null,
  ) {}

  /**
   * The outlooks of lineup windows at the watch's vantage. Any failure, even an unexpected one,
   * becomes 'unavailable' outlooks: the outlook never stops a scan or an e-mail.
   */
  private async outlooksOf(watch: WatchModel, windows: readonly TimeWindow[]): Promise<SkyOutlook[]> {
    if (windows.length === 0) return [];
    if (!this.forecast || !watch.sightline) return unavailableOutlooks(windows, NO_FORECAST_MESSAGE);
    try {
      return await this.forecast.outlookFor(watch.sightline.vantageLat, watch.sightline.vantageLon, windows);
    } catch (error) {
      console.error(`Watch ${watch.id}: the sky outlook failed:`, errorText(error));
      return unavailableOutlooks(windows, 'The forecast is unavailable just now');
    }
  }

  /** The last e-mail sent for a lineup with a longer lead than `leadDays` that showed an outlook. */
  private async earlierMail(watchId: string, lineupStart: Date, leadDays: number): Promise<EarlierMail | null> {
    const rows = await this.sequelize.query<{ sent_at: Date; outlook: unknown }>(
      `SELECT sent_at, outlook FROM watch_deliveries
       WHERE watch_id = :watchId AND lead_days > :leadDays AND status = 'sent' AND outlook IS NOT NULL
         AND lineup_start BETWEEN CAST(:lineupStart AS timestamptz) - interval '${SAME_LINEUP_MINUTES} minutes'
                              AND CAST(:lineupStart AS timestamptz) + interval '${SAME_LINEUP_MINUTES} minutes'
       ORDER BY sent_at DESC LIMIT 1`,
      { type: QueryTypes.SELECT, replacements: { watchId, leadDays, lineupStart } },
    );
    const row = rows[0];
    if (!row) return null;
    const parsed = skyOutlookSchema.safeParse(row.outlook);
    // A row kept in an older shape is no baseline; the e-mail goes on without the comparison.
    return parsed.success ? { sentAt: new Date(row.sent_at), outlook: parsed.data } : null;
  }

  /** The decision for one due e-mail, looking up the earlier e-mail only when it can matter. */
  private async decide(watch: WatchModel, lineupStart: Date, leadDays: number, outlook: SkyOutlook): Promise<{ decision: WatchOutlookDecision; earlier: EarlierMail | null }> {
    const maxCloudPct = watch.maxCloudPct ?? null;
    // Only the on-the-day e-mail compares with an earlier one ("still clear?").
    const earlier = leadDays === 0 ? await this.earlierMail(watch.id, lineupStart, leadDays) : null;
    return { decision: watchOutlookDecision({ maxCloudPct, outlook, leadDays, previous: earlier?.outlook ?? null }), earlier };
  }

  /** The lineups of `due` not yet recorded for the watch (same lead, start within SAME_LINEUP_MINUTES). */
  private async unrecorded<T extends { lineup: Lineup; lead: number }>(watchId: string, due: readonly T[]): Promise<T[]> {
    if (due.length === 0) return [];
    const from = new Date(Math.min(...due.map((d) => Date.parse(d.lineup.start))) - SAME_LINEUP_MINUTES * 60_000 - 60_000);
    const rows = await this.sequelize.query<{ lineup_start: Date; lead_days: number }>(
      'SELECT lineup_start, lead_days FROM watch_deliveries WHERE watch_id = :watchId AND lineup_start >= :from',
      { type: QueryTypes.SELECT, replacements: { watchId, from } },
    );
    return due.filter((d) => {
      const start = deliveryLineupStart(d.lineup).getTime();
      return !rows.some((r) => r.lead_days === d.lead && Math.abs(new Date(r.lineup_start).getTime() - start) <= SAME_LINEUP_MINUTES * 60_000);
    });
  }

  /**
   * Records every e-mail due at `now` for the active watches and returns the deliveries to send:
   * the new ones and those whose sender was lost. Rows whose lineup has begun unsent are skipped.
   */
  async scan(now: Date): Promise<ScanResult> {
    await this.sequelize.query(
      `UPDATE watch_deliveries SET status = 'skipped', last_error = 'The lineup began before the e-mail was sent', updated_at = now()
       WHERE status = 'pending' AND lineup_start <= :now`,
      { replacements: { now } },
    );

    const watches = await WatchModel.findAll({
      where: { paused: false },
      include: [{ model: SightlineModel, as: 'sightline' }, { model: UserModel, as: 'owner' }],
      order: [['createdAt', 'ASC']],
    });
    const toSend: string[] = [];
    let created = 0;
    let failedWatches = 0;
    let heldBackByCloud = 0;
    for (const watch of watches) {
      const owner = (watch as WatchModel & { owner?: UserModel }).owner;
      if (!owner || owner.disabled || !watch.sightline) continue;
      let found;
      try {
        found = await this.finder.find(watch, owner, scanRange(now, Math.max(...watch.leadDays)));
      } catch (error) {
        failedWatches += 1;
        // The owner can no longer read the sightline (e.g. left its crew): nothing to announce.
        if (error instanceof AppError && (error.code === 'not_found' || error.code === 'forbidden')) continue;
        console.error(`Watch ${watch.id}: the lineup search failed:`, errorText(error));
        continue;
      }
      let due = found.lineups
        .map((lineup) => ({ lineup, lead: currentLead(new Date(lineup.start), watch.leadDays, found.timezone, now) }))
        .filter((d): d is { lineup: Lineup; lead: number } => d.lead !== undefined);
      if (watch.maxCloudPct !== null && watch.maxCloudPct !== undefined) {
        // A cloud limit: judge the e-mails not yet recorded on one outlook request for the watch.
        due = await this.unrecorded(watch.id, due);
        const outlooks = await this.outlooksOf(watch, due.map((d) => ({ start: new Date(d.lineup.start), end: new Date(d.lineup.end) })));
        const kept: typeof due = [];
        for (const [i, d] of due.entries()) {
          const { decision } = await this.decide(watch, deliveryLineupStart(d.lineup), d.lead, outlooks[i]!);
          if (decision.send) kept.push(d);
          else heldBackByCloud += 1;
        }
        due = kept;
      }
      for (const { lineup, lead } of due) {
        const id = await this.record(watch, lineup, lead, { lineup, timezone: found.timezone, target: { ...found.target, name: found.targetName } });
        if (id) {
          created += 1;
          toSend.push(id);
        }
      }
    }

    const orphans = await this.sequelize.query<{ id: string }>(
      `SELECT id FROM watch_deliveries
       WHERE lineup_start > :now AND (
         (status = 'pending' AND updated_at < now() - make_interval(secs => :orphanSecs))
         OR (status = 'sending' AND claimed_at < now() - make_interval(secs => :leaseSecs)))`,
      { type: QueryTypes.SELECT, replacements: { now, orphanSecs: this.settings.orphanAfterMs / 1000, leaseSecs: this.settings.claimLeaseMs / 1000 } },
    );
    for (const { id } of orphans) if (!toSend.includes(id)) toSend.push(id);
    return { toSend, created, failedWatches, heldBackByCloud };
  }

  /**
   * Inserts the delivery unless it exists; its id when this call created it. The unique key makes
   * this safe against any concurrency; the NOT EXISTS also treats a lineup found again a few
   * minutes off (its sightline was nudged) as the same one, so it is not announced twice.
   */
  private async record(watch: WatchModel, lineup: Lineup, leadDays: number, snapshot: DeliverySnapshot): Promise<string | undefined> {
    const lineupStart = deliveryLineupStart(lineup);
    const rows = await this.sequelize.query<{ id: string }>(
      `INSERT INTO watch_deliveries (id, watch_id, lineup_start, lead_days, status, snapshot, message_id, created_at, updated_at)
       SELECT :id, :watchId, CAST(:lineupStart AS timestamptz), :leadDays, 'pending', CAST(:snapshot AS jsonb), :messageId, now(), now()
       WHERE NOT EXISTS (
         SELECT 1 FROM watch_deliveries d
         WHERE d.watch_id = :watchId AND d.lead_days = :leadDays
           AND d.lineup_start BETWEEN CAST(:lineupStart AS timestamptz) - interval '${SAME_LINEUP_MINUTES} minutes'
                                  AND CAST(:lineupStart AS timestamptz) + interval '${SAME_LINEUP_MINUTES} minutes')
       ON CONFLICT (watch_id, lineup_start, lead_days) DO NOTHING
       RETURNING id`,
      {
        type: QueryTypes.SELECT,
        replacements: {
          id: randomUUID(),
          watchId: watch.id,
          lineupStart,
          leadDays,
          snapshot: JSON.stringify(snapshot),
          messageId: deliveryMessageId(watch.id, lineupStart, leadDays),
        },
      },
    );
    return rows[0]?.id;
  }

  /** Step 1: pending (or abandoned) -> sending under a new claim token; undefined when not claimable. */
  private async claim(deliveryId: string): Promise<{ delivery: WatchDeliveryModel; token: string } | undefined> {
    const token = randomUUID();
    const claimed = await this.sequelize.transaction(async (transaction) => this.sequelize.query<{ id: string }>(
      `UPDATE watch_deliveries
       SET status = 'sending', claimed_at = now(), claim_token = :token, attempts = attempts + 1, updated_at = now()
       WHERE id = :id AND (status = 'pending' OR (status = 'sending' AND claimed_at < now() - make_interval(secs => :leaseSecs)))
       RETURNING id`,
      { type: QueryTypes.SELECT, replacements: { id: deliveryId, token, leaseSecs: this.settings.claimLeaseMs / 1000 }, transaction },
    ));
    if (claimed.length === 0) return undefined;
    const delivery = await WatchDeliveryModel.findByPk(deliveryId);
    return delivery ? { delivery, token } : undefined;
  }

  /** Ends a claim with the given change, only while the claim is still ours; true when it was. */
  private async finish(deliveryId: string, token: string, change: { status: 'sent' | 'pending' | 'failed' | 'skipped'; lastError?: string | null; recipient?: string; outlook?: SkyOutlook }): Promise<boolean> {
    // The outlook is kept without its hours: a later e-mail compares only the summary.
    const outlook = change.outlook ? JSON.stringify(change.outlook.status === 'forecast' ? { ...change.outlook, hours: [] } : change.outlook) : null;
    const rows = await this.sequelize.query<{ id: string }>(
      `UPDATE watch_deliveries
       SET status = :status, last_error = :lastError, claim_token = NULL, updated_at = now(),
           sent_at = CASE WHEN :status = 'sent' THEN now() ELSE sent_at END,
           recipient = COALESCE(:recipient, recipient),
           outlook = COALESCE(CAST(:outlook AS jsonb), outlook)
       WHERE id = :id AND claim_token = :token AND status = 'sending'
       RETURNING id`,
      { type: QueryTypes.SELECT, replacements: { id: deliveryId, token, status: change.status, lastError: change.lastError ?? null, recipient: change.recipient ?? null, outlook } },
    );
    return rows.length === 1;
  }

  /**
   * Deletes a claimed row whose e-mail is no longer to go (the sky clouded over past the watch's
   * limit since the scan). Nothing was sent, so nothing can go twice; a later scan may record the
   * e-mail again if the sky clears while its lead time is current.
   */
  private async withdraw(deliveryId: string, token: string): Promise<void> {
    await this.sequelize.query(
      `DELETE FROM watch_deliveries WHERE id = :id AND claim_token = :token AND status = 'sending'`,
      { replacements: { id: deliveryId, token } },
    );
  }

  /**
   * Sends one delivery (steps 1-3 above). Returns what happened; throws RetryableSendError on a
   * temporary SMTP failure while attempts remain, so the queue retries it with back-off.
   * @param now the scheduler's clock: a lineup that has begun is skipped
   */
  async send(deliveryId: string, now: Date): Promise<SendOutcome> {
    const claim = await this.claim(deliveryId);
    if (!claim) return 'not-claimed';
    const { delivery, token } = claim;

    const watch = await WatchModel.findByPk(delivery.watchId, {
      include: [{ model: SightlineModel, as: 'sightline' }, { model: UserModel, as: 'owner' }],
    });
    const owner = (watch as (WatchModel & { owner?: UserModel }) | null)?.owner;
    const skipReason = !watch || !watch.sightline || !owner ? 'The watch is gone'
      : watch.paused ? 'The watch was paused'
        : owner.disabled ? 'The account is disabled'
          : delivery.lineupStart.getTime() <= now.getTime() ? 'The lineup began before the e-mail was sent'
            : undefined;
    if (skipReason) {
      await this.finish(deliveryId, token, { status: 'skipped', lastError: skipReason });
      return 'skipped';
    }

    const { lineup } = delivery.snapshot;
    const [outlook] = await this.outlooksOf(watch!, [{ start: new Date(lineup.start), end: new Date(lineup.end) }]);
    const { decision, earlier } = await this.decide(watch!, delivery.lineupStart, delivery.leadDays, outlook!);
    if (!decision.send) {
      await this.withdraw(deliveryId, token);
      return 'skipped';
    }
    const mail = await this.compose(delivery, watch!, owner!, now, {
      outlook: outlook!, maxCloudPct: watch!.maxCloudPct ?? null, decision, earlier: earlier?.outlook ?? null,
    });
    try {
      await this.mailer.send(mail);
    } catch (error) {
      const code = smtpResponseCode(error);
      const permanent = code !== undefined && code >= 500 && code < 600;
      const lastError = `${code ? `SMTP ${code}: ` : ''}${errorText(error)}`;
      if (permanent || delivery.attempts >= this.settings.maxAttempts) {
        await this.finish(deliveryId, token, { status: 'failed', lastError });
        return 'failed';
      }
      await this.finish(deliveryId, token, { status: 'pending', lastError });
      throw new RetryableSendError(`Delivery ${deliveryId}, attempt ${delivery.attempts}: ${lastError}`);
    }
    const ours = await this.finish(deliveryId, token, { status: 'sent', lastError: null, recipient: owner!.email, outlook: outlook! });
    if (!ours) console.warn(`Delivery ${deliveryId}: sent, but its claim had passed to another sender (the e-mail may go twice, with the same Message-ID)`);
    return 'sent';
  }

  private async compose(delivery: WatchDeliveryModel, watch: WatchModel, owner: UserModel, now: Date, outlook: WatchEmailOutlook) {
    const sightline = watch.sightline!;
    const { lineup, timezone, target } = delivery.snapshot;
    const notes = await FieldNoteModel.findAll({ where: { sightlineId: sightline.id }, order: [['createdAt', 'ASC']] });
    const cautions: WatchEmailCaution[] = notes
      .sort((a, b) => (NOTE_ORDER[a.kind] ?? 9) - (NOTE_ORDER[b.kind] ?? 9))
      .slice(0, MAX_NOTES)
      .map((n) => ({ kind: n.kind, body: n.body.length > MAX_NOTE_CHARS ? `${n.body.slice(0, MAX_NOTE_CHARS - 1)}…` : n.body }));
    const token = this.tokens.sign({ deliveryId: delivery.id, watchId: watch.id });
    const base = this.settings.appUrl;
    const night = nightOf(new Date(lineup.start), timezone);
    const links = {
      nightChart: `${base}/sightlines/${sightline.id}?tab=night&night=${night}`,
      unsubscribe: `${base}/watches/unsubscribe?token=${encodeURIComponent(token)}`,
      watches: `${base}/watches`,
    };
    const rendered = renderWatchEmail({
      sightlineName: sightline.name,
      timezone,
      targetName: target.name,
      lineup,
      leadDays: delivery.leadDays,
      now,
      hasTideRule: Boolean(sightline.tideRule),
      cautions,
      links,
      outlook,
    });
    const ics = watchedLineupsToIcs(`Gnomon: ${sightline.name}`, [{
      watchId: watch.id,
      sightlineName: sightline.name,
      targetName: target.name,
      timezone,
      vantage: { lat: sightline.vantageLat, lon: sightline.vantageLon },
      lineup,
      nightChartUrl: links.nightChart,
    }], 'PUBLISH');
    return {
      from: this.settings.mailFrom,
      to: owner.email,
      subject: rendered.subject,
      text: rendered.text,
      html: rendered.html,
      messageId: delivery.messageId,
      headers: {
        // One-click unsubscribe (RFC 8058): the API pauses the watch on a POST to this address.
        'List-Unsubscribe': `<${base}/api/watches/unsubscribe?token=${encodeURIComponent(token)}>`,
        'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
        'X-Gnomon-Watch': watch.id,
      },
      attachments: [{ filename: `gnomon-lineup-${night}.ics`, content: ics, contentType: 'text/calendar; charset=utf-8; method=PUBLISH' }],
    };
  }
}
