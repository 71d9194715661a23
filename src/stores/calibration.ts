import { computed, ref } from 'vue';
import { defineStore } from 'pinia';
import { calibrationsApi, type PointWrite, type SessionDetail } from '@/services/calibrations';
import type { SessionPatchBody } from '@shared/schemas/calibration';
import { useBoardsStore } from './boards';

/** The calibration session on screen: its points, fit and comparison as the server last computed them. */
export const useCalibrationStore = defineStore('calibration', () => {
  const session = ref<SessionDetail | null>(null);
  const complete = computed(() => session.value?.state === 'complete');
  const channelName = computed(() => {
    const s = session.value;
    return s ? useBoardsStore().channelName(s.board.revisionId, s.channelKey) : '';
  });

  function adopt(next: SessionDetail): SessionDetail {
    session.value = next;
    return next;
  }

  const id = () => {
    if (!session.value) throw new Error('no calibration session is open');
    return session.value.id;
  };

  async function open(sessionId: number): Promise<SessionDetail> {
    const next = await calibrationsApi.get(sessionId);
    await useBoardsStore().channelsOf(next.board.revisionId);
    return adopt(next);
  }

  const update = async (patch: SessionPatchBody) => adopt(await calibrationsApi.update(id(), patch));
  // Both name the points version on screen, so a change someone else saved meanwhile is not overwritten.
  const replacePoints = async (points: PointWrite[]) => adopt(await calibrationsApi.replacePoints(id(), points, session.value!.pointsVersion));
  const setExclusion = async (pointId: number, excluded: boolean, reason: string) =>
    adopt(await calibrationsApi.setExclusion(id(), pointId, excluded, reason, session.value!.pointsVersion));
  const markComplete = async () => adopt(await calibrationsApi.complete(id()));
  const reopen = async () => adopt(await calibrationsApi.reopen(id()));

  return { session, complete, channelName, open, adopt, update, replacePoints, setExclusion, markComplete, reopen };
});
