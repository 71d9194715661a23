import { computed, type Ref } from 'vue';
import { compileChannel, nominalReadouts, type ChainWarning, type NominalReadouts } from '@shared/chain';
import { channelWorstCase } from '@shared/propagation/channel-analytic';
import type { ChannelDefinition } from '@shared/schemas/chain';
import { capitalise } from '@/utils/formatQuantity';

/** Chain stages as the editor names its sections; a warning's `where` starts with one of them. */
export type Stage = 'rangeV' | 'divider' | 'converter' | 'isolator' | 'capture' | 'environment' | 'reconstruction';

/** The largest worst-case reading error across the range, and the input voltage where it occurs. */
export interface WorstCaseReadout {
  maxAbsV: number;
  atV: number;
}

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
  const outcome = computed<{ readouts: NominalReadouts | null; worstCase: WorstCaseReadout | null; problem: string | null }>(() => {
    try {
      const readouts = nominalReadouts(channel.value, GRID_POINTS);
      // A few milliseconds at five voltages; values are committed on blur, not per keystroke.
      const points = channelWorstCase(compileChannel(channel.value, GRID_POINTS));
      const worst = points.reduce((a, b) => (b.maxAbs > a.maxAbs ? b : a));
      return { readouts, worstCase: { maxAbsV: worst.maxAbs, atV: worst.voltageV }, problem: null };
    } catch (error) {
      return { readouts: null, worstCase: null, problem: capitalise((error as Error).message) };
    }
  });

  const readouts = computed(() => outcome.value.readouts);
  const worstCase = computed(() => outcome.value.worstCase);
  const problem = computed(() => outcome.value.problem);
  const warnings = computed<ChainWarning[]>(() => readouts.value?.warnings ?? []);

  /** Warnings of one stage, for showing beside that section. */
  function warningsFor(stage: Stage): ChainWarning[] {
    return warnings.value.filter((warning) => stageOf(warning.where) === stage);
  }

  /** Whether the resistor at `where` (`divider.top[2]`, `divider.bottom`) has a warning (not a note). */
  function resistorWarned(where: string): boolean {
    return warnings.value.some((warning) => warning.where === where && warning.level !== 'info');
  }

  /** A check that could not be made for the resistor at `where` (a rating not entered), shown on its row. */
  function resistorNote(where: string): string | undefined {
    const note = warnings.value.find((warning) => warning.where === where && warning.level === 'info');
    return note && capitalise(note.message);
  }

  return { readouts, worstCase, problem, warnings, warningsFor, resistorWarned, resistorNote };
}

export type ChannelReadouts = ReturnType<typeof useChannelReadouts>;
