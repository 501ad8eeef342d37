import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { CrewInviteCreated, CrewInviteInput, CrewResponse } from '../../shared/schemas/crew';
import type { CrewRole } from '../../shared/policy/sightline-policy';
import type { Outing, OutingInputBody } from '../../shared/schemas/outing';
import * as crewApi from '@/api/crew';
import * as outingsApi from '@/api/outings';

/** The crew and the outings of the open sightline. */
export const useCrewStore = defineStore('crew', () => {
  const sightlineId = ref<string | null>(null);
  const crew = ref<CrewResponse | null>(null);
  const outings = ref<Outing[]>([]);
  const loading = ref(false);
  const loadError = ref('');

  async function load(id: string): Promise<void> {
    if (sightlineId.value !== id) {
      crew.value = null;
      outings.value = [];
    }
    sightlineId.value = id;
    loading.value = true;
    loadError.value = '';
    try {
      const [c, o] = await Promise.all([crewApi.getCrew(id), outingsApi.listOutings(id)]);
      if (sightlineId.value !== id) return;
      crew.value = c;
      outings.value = o;
    } catch (error) {
      loadError.value = (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  function requireId(): string {
    if (!sightlineId.value) throw new Error('No sightline is open');
    return sightlineId.value;
  }

  async function invite(input: CrewInviteInput): Promise<CrewInviteCreated> {
    const id = requireId();
    const created = await crewApi.inviteToCrew(id, input);
    crew.value = await crewApi.getCrew(id);
    return created;
  }

  async function revoke(inviteId: string): Promise<void> {
    const id = requireId();
    await crewApi.revokeInvite(id, inviteId);
    crew.value = await crewApi.getCrew(id);
  }

  async function changeRole(userId: string, role: CrewRole): Promise<void> {
    crew.value = await crewApi.changeCrewRole(requireId(), userId, role);
  }

  async function remove(userId: string): Promise<void> {
    crew.value = await crewApi.removeFromCrew(requireId(), userId);
  }

  async function leave(myId: string): Promise<void> {
    await crewApi.leaveCrew(requireId(), myId);
    crew.value = null;
  }

  async function handOver(userId: string): Promise<void> {
    crew.value = await crewApi.handOver(requireId(), userId);
  }

  async function planOuting(body: OutingInputBody): Promise<Outing> {
    const outing = await outingsApi.createOuting(requireId(), body);
    outings.value = [...outings.value, outing].sort((a, b) => a.night.localeCompare(b.night) || a.meetingAt.localeCompare(b.meetingAt));
    return outing;
  }

  return { sightlineId, crew, outings, loading, loadError, load, invite, revoke, changeRole, remove, leave, handOver, planOuting };
});
