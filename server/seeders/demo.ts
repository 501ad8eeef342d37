/**
 * The demo scenario: invented people and invented sightlines at real coastlines (coordinates of our
 * own choosing, names made up). Seeding is idempotent: it creates what is missing and never touches
 * an account outside this list, nor a demo account's sightline it did not create.
 */
import type { Sequelize } from 'sequelize';
import { DateTime } from 'luxon';
import type { Role } from '../../shared/schemas/auth';
import type { SightlineInput, FieldNoteInput } from '../../shared/schemas/sightline';
import type { TideRule } from '../../shared/tide';
import { SightlineModel } from '../models/sightline';
import { UserModel } from '../models/user';
import { watchInputSchema, type WatchInputBody } from '../../shared/schemas/watch';
import { WatchService } from '../services/watch-service';
import type { AuthService } from '../services/auth-service';
import { FieldNoteService } from '../services/field-note-service';
import { SightlineService } from '../services/sightline-service';
import { TideService } from '../services/tide-service';
import { demoTideLines } from './demo-tides';
import { demoScenePhoto } from './demo-photo';
import { seedDemoGear } from './demo-gear';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import { CrewMemberModel } from '../models/crew-member';
import { OutingService } from '../services/outing-service';
import { PhotoService } from '../services/photo-service';
import type { PhotoStorage } from '../storage/photo-storage';

export const DEMO_PASSWORD = 'nightfall-demo';

export const demoAccounts: ReadonlyArray<{ name: string; email: string; role: Role }> = [
  { name: 'Ines Marlowe', email: 'ines@demo.gnomon.test', role: 'admin' },
  { name: 'Tomas Quill', email: 'tomas@demo.gnomon.test', role: 'member' },
  { name: 'Priya Ventner', email: 'priya@demo.gnomon.test', role: 'member' },
];

interface DemoSightline {
  ownerEmail: string;
  input: SightlineInput;
  tideRule?: TideRule;
  tides?: { firstLowMinutes: number; meanRangeM: number };
  notes: FieldNoteInput[];
  /**
   * A watch the owner keeps on it. Demo watches start paused: mail from the demo goes only to the
   * local SMTP fake anyway, and the demo addresses are under the reserved .test domain.
   */
  watch?: Omit<WatchInputBody, 'sightlineId'>;
  /** People of the demo in its crew. */
  crew?: Array<{ email: string; role: CrewRole }>;
  /** An outing this many days after seeding, meeting at a local time, at the vantage. */
  outing?: { inDays: number; meetAt: string; meetingNote: string; gearNotes: string };
  /** Gets the invented, calibrated daytime photo (when photo storage is given). */
  photo?: boolean;
}

/** What the demo needs beyond the database: where photo files go (none: no demo photo). */
export interface SeedDemoOptions {
  photoStorage?: PhotoStorage;
}

const INVENTED_TIDES_NOTE: FieldNoteInput = {
  kind: 'tide',
  body: 'Demo only: these tide times are invented and predict nothing. For a real trip paste the official table for the nearest port.',
};

export const demoSightlines: readonly DemoSightline[] = [
  {
    ownerEmail: 'tomas@demo.gnomon.test',
    input: {
      name: 'Kestrel Stack from the south cove',
      vantage: { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 },
      landmark: { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 },
      bandHeightDeg: 20,
      targetId: 'galactic-centre',
    },
    tideRule: { mode: 'around-low', hoursBefore: 2.5, hoursAfter: 2, note: 'The cove is sand only around low water.' },
    tides: { firstLowMinutes: 4 * 60 + 10, meanRangeM: 5.2 },
    watch: { minScore: 0.4, minDurationMin: 15, reachableOnly: true, weekdays: [5, 6], leadDays: [3, 0], paused: true },
    crew: [{ email: 'priya@demo.gnomon.test', role: 'viewer' }],
    outing: {
      inDays: 12,
      meetAt: '21:30',
      meetingNote: 'Lay-by at the top of the cove steps',
      gearNotes: 'Head torch with a red mode, warm layers, spare batteries. Check the official tide table before we go down.',
    },
    photo: true,
    notes: [
      { kind: 'access', body: 'Steps down from the coast path, 15 minutes from the lay-by. Slippery when wet.' },
      { kind: 'hazard', body: 'The incoming tide fills the cove from the north side first: leave by the steps, not along the rocks.' },
      INVENTED_TIDES_NOTE,
    ],
  },
  {
    ownerEmail: 'tomas@demo.gnomon.test',
    input: {
      name: 'Heron Arch at the point',
      vantage: { lat: 37.0855, lon: -8.6705, elevationM: 2, cameraHeightM: 1.4 },
      landmark: { lat: 37.0819, lon: -8.6680, baseElevationM: 0, heightM: 22, widthM: 30 },
      bandHeightDeg: 25,
      targetId: 'galactic-centre',
    },
    tideRule: { mode: 'except-around-high', hoursBefore: 1.5, hoursAfter: 1.5 },
    tides: { firstLowMinutes: 2 * 60 + 40, meanRangeM: 2.8 },
    notes: [
      { kind: 'access', body: 'Beach access down the wooden stairs at the west end; the gate closes at 22:00 in summer.' },
      { kind: 'hazard', body: 'Cliff falls reported above the arch: stay out of the overhang.' },
      INVENTED_TIDES_NOTE,
    ],
  },
  {
    ownerEmail: 'priya@demo.gnomon.test',
    input: {
      name: 'Lantern Rocks, east platform',
      vantage: { lat: -38.6650, lon: 143.1040, elevationM: 40, cameraHeightM: 1.6 },
      landmark: { lat: -38.6672, lon: 143.1102, baseElevationM: 0, heightM: 45, widthM: 20 },
      bandHeightDeg: 30,
      targetId: 'galactic-centre',
    },
    crew: [{ email: 'tomas@demo.gnomon.test', role: 'editor' }],
    notes: [
      { kind: 'access', body: 'Viewing platform by the car park; the boardwalk is lit until 23:00.' },
      { kind: 'general', body: 'Fence line: do not go past it for a lower angle, the edge is undercut.' },
    ],
  },
  {
    ownerEmail: 'ines@demo.gnomon.test',
    input: {
      name: 'Curlew Sea Cave mouth',
      vantage: { lat: 52.9712, lon: -9.4300, elevationM: 1, cameraHeightM: 1.2 },
      landmark: { lat: 52.9703, lon: -9.4318, baseElevationM: 0, heightM: 12, widthM: 20 },
      bandHeightDeg: 20,
      targetId: 'm42',
    },
    tideRule: { mode: 'around-low', hoursBefore: 1.5, hoursAfter: 1.5, note: 'Only the two hours around low water, and not in a swell.' },
    tides: { firstLowMinutes: 5 * 60 + 30, meanRangeM: 3.9 },
    notes: [
      { kind: 'hazard', body: 'Never go into the cave: the back floods first and the swell surges without warning.' },
      { kind: 'tide', body: 'Check the official tide table for the nearest port and add an hour of margin.' },
      INVENTED_TIDES_NOTE,
    ],
  },
];

/** Creates the demo accounts and sightlines that do not exist yet; returns how many things were created. */
export async function seedDemo(auth: AuthService, sequelize: Sequelize, options: SeedDemoOptions = {}): Promise<number> {
  let created = 0;
  const users = new Map<string, UserModel>();
  for (const account of demoAccounts) {
    let user = await UserModel.findOne({ where: { email: account.email } });
    if (!user) {
      user = await UserModel.create({ ...account, passwordHash: await auth.hashPassword(DEMO_PASSWORD) });
      created += 1;
    }
    users.set(account.email, user);
  }

  const sightlines = new SightlineService();
  const notes = new FieldNoteService(sightlines);
  const tides = new TideService(sequelize, sightlines);
  const watches = new WatchService(sightlines);
  const outings = new OutingService(sightlines);
  const photos = options.photoStorage ? new PhotoService(sequelize, sightlines, options.photoStorage, { maxPixels: 100_000_000, perSightline: 20 }) : null;
  for (const demo of demoSightlines) {
    const owner = users.get(demo.ownerEmail)!;
    if (await SightlineModel.findOne({ where: { ownerId: owner.id, name: demo.input.name } })) continue;
    const sightline = await sightlines.create(owner, demo.input);
    if (demo.tideRule) await tides.setRule(owner, sightline.id, demo.tideRule);
    if (demo.tides) {
      const startDate = DateTime.now().setZone(sightline.timezone).toISODate()!;
      const lines = demoTideLines({ startDate, days: 31, timeZone: sightline.timezone, ...demo.tides });
      await tides.paste(owner, sightline.id, lines.join('\n'));
    }
    for (const note of demo.notes) await notes.create(owner, sightline.id, note);
    // Made with its sightline only, so a watch the person deleted is not brought back. Not counted:
    // the count is of accounts and sightlines.
    if (demo.watch) await watches.create(owner, watchInputSchema.parse({ ...demo.watch, sightlineId: sightline.id }));
    for (const member of demo.crew ?? []) {
      await CrewMemberModel.create({ sightlineId: sightline.id, userId: users.get(member.email)!.id, role: member.role });
    }
    if (demo.outing) {
      const night = DateTime.now().setZone(sightline.timezone).plus({ days: demo.outing.inDays }).toISODate()!;
      await outings.create(owner, sightline.id, {
        night, lineup: null, meetingPoint: { lat: sightline.vantageLat, lon: sightline.vantageLon },
        meetingLocal: `${night}T${demo.outing.meetAt}`, meetingNote: demo.outing.meetingNote, gearNotes: demo.outing.gearNotes,
      });
    }
    if (demo.photo && photos) {
      const scene = await demoScenePhoto(sightline.toPublic());
      const photo = await photos.add(owner, sightline.id, { buffer: scene.jpeg, originalName: scene.name });
      await photos.calibrate(owner, photo.id, scene.calibration);
    }
    created += 1;
  }
  // Gear is counted apart: the count is of accounts and sightlines.
  await seedDemoGear(sequelize);
  return created;
}
