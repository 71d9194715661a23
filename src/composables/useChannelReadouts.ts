import { computed, type Ref } from 'vue';
import { nominalReadouts, type ChainWarning, type NominalReadouts } from '@shared/chain';
import type { ChannelDefinition } from '@shared/schemas/chain';
import { capitalise } from '@/utils/formatQuantity';

/** Chain stages as the editor names its sections; a warning's `where` starts with one of them. */
export type Stage = 'rangeV' | 'divider' | 'converter' | 'isolator' | 'capture' | 'environment';

/** Evaluation voltages the side panel lists across the range. */
const GRID_POINTS = 5;

function stageOf(where: string): Stage {
  return where.split(/[.[]/)[0] as Stage;
}

/**
 * Live nominal readouts of one channel, recomputed by the shared engine on every change. When the
 * engine refuses the inputs, `problem` says why and the last good readouts are not shown.
 */
export function useChannelReadouts(channel: Ref<ChannelDefinition>) {
  const outcome = computed<{ readouts: NominalReadouts | null; problem: string | null }>(() => {
    try {
      return { readouts: nominalReadouts(channel.value, GRID_POINTS), problem: null };
    } catch (error) {
      return { readouts: null, problem: capitalise((error as Error).message) };
    }
  });

  const readouts = computed(() => outcome.value.readouts);
  const problem = computed(() => outcome.value.problem);
  const warnings = computed<ChainWarning[]>(() => readouts.value?.warnings ?? []);

  /** Warnings of one stage, for showing beside that section. */
  function warningsFor(stage: Stage): ChainWarning[] {
    return warnings.value.filter((warning) => stageOf(warning.where) === stage);
  }

  /** Whether the resistor at `where` (`divider.top[2]`, `divider.bottom`) has a warning. */
  function resistorWarned(where: string): boolean {
    return warnings.value.some((warning) => warning.where === where);
  }

  return { readouts, problem, warnings, warningsFor, resistorWarned };
}

export type ChannelReadouts = ReturnType<typeof useChannelReadouts>;
