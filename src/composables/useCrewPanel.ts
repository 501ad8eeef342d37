import { computed, reactive, ref, watch } from 'vue';
import { useRouter } from 'vue-router';
import { useDialog, useMessage } from 'naive-ui';
import { DateTime } from 'luxon';
import { crewInviteInputSchema } from '../../shared/schemas/crew';
import { roleAllows, type CrewRole } from '../../shared/policy/sightline-policy';
import { outingInputSchema, type Outing } from '../../shared/schemas/outing';
import type { CrewMember } from '../../shared/schemas/crew';
import { useCrewStore } from '@/stores/crew';
import { useSessionStore } from '@/stores/session';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { useLineupsStore } from '@/stores/lineups';
import { useFieldErrors } from './useFieldErrors';
import { clockOf, nightLabel, nightOf } from './useLineupTime';

export const CREW_ROLE_OPTIONS: { label: string; value: CrewRole }[] = [
  { label: 'Editor: changes the plan', value: 'editor' },
  { label: 'Viewer: sees it, adds notes', value: 'viewer' },
];

const MINUTE_MS = 60_000;

/** The crew section of a sightline page: members and roles, invites, leaving, and outings. */
export function useCrewPanel() {
  const store = useCrewStore();
  const detail = useSightlineDetailStore();
  const lineups = useLineupsStore();
  const session = useSessionStore();
  const router = useRouter();
  const dialog = useDialog();
  const message = useMessage();

  watch(() => detail.id, (id) => { if (id) void store.load(id); }, { immediate: true });

  const role = computed(() => store.crew?.myRole ?? detail.sightline?.myRole ?? 'outsider');
  const canManage = computed(() => roleAllows(role.value, 'manage-crew'));
  const canPlan = computed(() => roleAllows(role.value, 'plan-outing'));
  const canLeave = computed(() => roleAllows(role.value, 'leave'));
  const timeZone = computed(() => detail.timeZone);
  const pendingInvites = computed(() => (store.crew?.invites ?? []).filter((i) => i.status === 'pending'));

  // Invites.
  const invite = reactive({ email: '', role: 'viewer' as CrewRole, busy: false });
  const inviteErrors = useFieldErrors<'email' | 'role'>();
  const lastInvite = ref<{ email: string; link: string; mailSent: boolean; mailError: string | null } | null>(null);

  async function sendInvite(): Promise<void> {
    inviteErrors.clear();
    const parsed = crewInviteInputSchema.safeParse({ email: invite.email, role: invite.role });
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]) as 'email' | 'role';
        inviteErrors.fields[key] ??= issue.message;
      }
      return;
    }
    invite.busy = true;
    try {
      const created = await store.invite(parsed.data);
      lastInvite.value = { email: created.invite.email, link: created.link, mailSent: created.mailSent, mailError: created.mailError };
      if (created.mailSent) message.success(`Invite sent to ${created.invite.email}`);
      else message.warning('The invite is saved, but its e-mail did not go');
      invite.email = '';
    } catch (error) {
      if (!inviteErrors.take(error)) throw error;
    } finally {
      invite.busy = false;
    }
  }

  function confirmRevoke(inviteId: string, email: string): void {
    dialog.warning({
      title: 'Withdraw this invite?',
      content: `The link sent to ${email} will stop working.`,
      positiveText: 'Withdraw',
      negativeText: 'Keep it',
      onPositiveClick: () => store.revoke(inviteId).catch((e: Error) => { message.error(e.message); }),
    });
  }

  async function changeRole(member: CrewMember, next: CrewRole): Promise<void> {
    try {
      await store.changeRole(member.userId, next);
      message.success(`${member.name} is now ${next === 'editor' ? 'an editor' : 'a viewer'}`);
    } catch (error) {
      message.error((error as Error).message);
    }
  }

  function confirmRemove(member: CrewMember): void {
    dialog.warning({
      title: `Remove ${member.name} from the crew?`,
      content: 'They lose access to this sightline, its notes, photos and outings.',
      positiveText: 'Remove',
      negativeText: 'Cancel',
      onPositiveClick: () => store.remove(member.userId).catch((e: Error) => { message.error(e.message); }),
    });
  }

  function confirmHandOver(member: CrewMember): void {
    dialog.warning({
      title: `Hand the sightline over to ${member.name}?`,
      content: `${member.name} becomes its owner and manages the crew; you stay in it as an editor. Only the new owner can undo this.`,
      positiveText: 'Hand over',
      negativeText: 'Cancel',
      onPositiveClick: async () => {
        try {
          await store.handOver(member.userId);
          await detail.open(detail.id!, true);
          message.success(`${member.name} owns the sightline now`);
        } catch (error) {
          message.error((error as Error).message);
        }
      },
    });
  }

  function confirmLeave(): void {
    const me = session.user;
    if (!me) return;
    dialog.warning({
      title: 'Leave this crew?',
      content: 'You lose access to this sightline until its owner invites you again.',
      positiveText: 'Leave',
      negativeText: 'Stay',
      onPositiveClick: async () => {
        try {
          await store.leave(me.id);
          message.success('You left the crew');
          await router.push({ name: 'sightlines' });
        } catch (error) {
          message.error((error as Error).message);
        }
      },
    });
  }

  // Outings.
  /** Nights with lineups in the current search, for the outing form. */
  const nightOptions = computed(() => {
    const seen = new Map<string, { label: string; value: string; lineupIndex: number }>();
    (lineups.search.result?.lineups ?? []).forEach((l, i) => {
      const night = nightOf(l.start, timeZone.value);
      if (!seen.has(night)) seen.set(night, { value: night, label: `${nightLabel(night)} · lineup ${clockOf(l.start, timeZone.value)}–${clockOf(l.end, timeZone.value)}`, lineupIndex: i });
    });
    return [...seen.values()];
  });

  const plan = reactive({ night: null as string | null, meetingLocal: '', lat: null as number | null, lon: null as number | null, meetingNote: '', gearNotes: '', busy: false });
  const planErrors = useFieldErrors<'night' | 'meetingLocal' | 'meetingPoint' | 'meetingNote' | 'gearNotes'>();

  /** Choosing a night proposes a meeting an hour before its lineup (rounded to 15 min) at the vantage. */
  function chooseNight(night: string): void {
    plan.night = night;
    const option = nightOptions.value.find((o) => o.value === night);
    const lineup = option ? lineups.search.result?.lineups[option.lineupIndex] : undefined;
    if (lineup) {
      const start = Date.parse(lineup.start) - 60 * MINUTE_MS;
      const rounded = Math.floor(start / (15 * MINUTE_MS)) * 15 * MINUTE_MS;
      plan.meetingLocal = DateTime.fromMillis(rounded, { zone: timeZone.value }).toFormat("yyyy-MM-dd'T'HH:mm");
    }
    if (plan.lat === null && detail.sightline) {
      plan.lat = detail.sightline.vantage.lat;
      plan.lon = detail.sightline.vantage.lon;
    }
  }

  function meetAtVantage(): void {
    if (!detail.sightline) return;
    plan.lat = detail.sightline.vantage.lat;
    plan.lon = detail.sightline.vantage.lon;
  }

  async function planOuting(): Promise<Outing | null> {
    planErrors.clear();
    const option = nightOptions.value.find((o) => o.value === plan.night);
    const lineup = option ? lineups.search.result?.lineups[option.lineupIndex] : undefined;
    const body = {
      night: plan.night ?? '',
      lineup: lineup ? { start: lineup.start, end: lineup.end, peak: lineup.peak } : null,
      meetingPoint: plan.lat !== null && plan.lon !== null ? { lat: plan.lat, lon: plan.lon } : undefined,
      meetingLocal: plan.meetingLocal,
      meetingNote: plan.meetingNote,
      gearNotes: plan.gearNotes,
    };
    const parsed = outingInputSchema.safeParse(body);
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const key = String(issue.path[0]) as 'night';
        planErrors.fields[key] ??= issue.message;
      }
      return null;
    }
    plan.busy = true;
    try {
      const outing = await store.planOuting({ ...body, meetingPoint: parsed.data.meetingPoint });
      message.success(`Outing planned for ${nightLabel(outing.night)}`);
      await router.push({ name: 'outing', params: { id: outing.sightlineId, outingId: outing.id } });
      return outing;
    } catch (error) {
      if (!planErrors.take(error)) throw error;
      return null;
    } finally {
      plan.busy = false;
    }
  }

  const outingRows = computed(() => store.outings.map((o) => ({
    ...o,
    nightText: nightLabel(o.night),
    meetingText: `${o.meetingLocal.slice(11)} ${DateTime.fromISO(o.meetingAt, { zone: o.timezone }).toFormat('ZZZZ')}`,
    going: o.people.filter((p) => p.answer === 'going').length,
    maybe: o.people.filter((p) => p.answer === 'maybe').length,
  })));

  return {
    store, session, role, canManage, canPlan, canLeave, timeZone, pendingInvites,
    invite, inviteErrors, lastInvite, sendInvite, confirmRevoke, changeRole, confirmRemove, confirmHandOver, confirmLeave,
    nightOptions, plan, planErrors, chooseNight, meetAtVantage, planOuting, outingRows,
  };
}
