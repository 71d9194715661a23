import { computed, reactive, ref } from 'vue';
import { findDividers, type DividerCandidate, type FinderRequest, type FinderResult } from '@shared/finder';
import { dividerNominal } from '@shared/chain';
import type { ChannelDefinition, ResistorDefinition } from '@shared/schemas/chain';
import type { StockPart } from '@/services/stock';
import { useSeriesStore } from '@/stores/series';
import { useStockStore } from '@/stores/stock';
import { capitalise } from '@/utils/formatQuantity';

export interface FinderForm {
  maxInputV: number | undefined;
  target: 'ratio' | 'fullScale';
  targetRatio: number | undefined;
  fullScaleV: number | undefined;
  source: 'series' | 'stock';
  /** name of a stored series (IEC 60063 or the team's own) */
  series: string;
  minTop: number | undefined;
  maxTop: number | undefined;
  mixed: boolean;
  /** the asked tolerance on the worst-case error at the highest input (%) */
  tolerancePct: number | undefined;
  minResistorOhm: number | undefined;
  maxResistorOhm: number | undefined;
  maxVoltsPerResistor: number | undefined;
  maxWattsPerResistor: number | undefined;
  maxBleedA: number | undefined;
  minTotalOhm: number | undefined;
  maxTotalOhm: number | undefined;
}

const lowest = (values: (number | undefined)[]) => {
  const known = values.filter((v): v is number => v !== undefined);
  return known.length ? Math.min(...known) : undefined;
};

/** The ratio as the live readouts show it (bottom loaded by the converter input), or none while a value is unusable. */
function shownRatio({ divider, converter }: ChannelDefinition): number | undefined {
  try {
    return Number(dividerNominal(divider, converter.inputResistanceOhm).ratio.toPrecision(4));
  } catch {
    return undefined;
  }
}

/** Starting constraints taken from the channel as it stands: its range, ratio, string length and derated ratings. */
function initialForm(channel: ChannelDefinition): FinderForm {
  const { divider, converter, rangeV } = channel;
  const derate = (v: number | undefined) => (v === undefined ? undefined : Number((v * divider.deratingFraction).toPrecision(3)));
  return {
    maxInputV: rangeV.maxV,
    target: 'ratio',
    targetRatio: shownRatio(channel),
    fullScaleV: Number(((converter.fullScaleHz - converter.offsetHz) / converter.gainHzPerV).toPrecision(4)),
    source: 'series',
    series: 'E96',
    minTop: divider.top.length,
    maxTop: divider.top.length,
    mixed: false,
    tolerancePct: 1,
    minResistorOhm: undefined,
    maxResistorOhm: undefined,
    maxVoltsPerResistor: derate(lowest(divider.top.map((r) => r.ratedVoltageV))),
    maxWattsPerResistor: derate(lowest(divider.top.map((r) => r.ratedPowerW))),
    maxBleedA: undefined,
    minTotalOhm: undefined,
    maxTotalOhm: undefined,
  };
}

/** The divider finder run in the browser: constraints, ranked candidates, and filling the divider with one. */
export function useDividerFinder(channel: () => ChannelDefinition) {
  const stockStore = useStockStore();
  const seriesStore = useSeriesStore();
  const form = reactive<FinderForm>(initialForm(channel()));
  const result = ref<FinderResult | null>(null);
  /** Where the shown result's values came from (the form may change after the search). */
  const searched = ref<{ source: FinderForm['source']; series: string }>({ source: form.source, series: form.series });
  const problem = ref<string | null>(null);
  const searching = ref(false);
  const stock = ref<StockPart[]>([]);
  const onHand = computed(() => {
    const map = new Map<number, number>();
    for (const part of stock.value) map.set(part.ohms, (map.get(part.ohms) ?? 0) + part.quantity);
    return map;
  });

  /** The converter the finder's ratios are computed for: the channel's, as the editor's readouts use it. */
  const converterLoad = computed(() => ({
    inputResistanceOhms: channel().converter.inputResistanceOhm,
    inputBiasAmps: channel().converter.inputBiasCurrentA,
  }));

  function request(): FinderRequest {
    if (form.maxInputV === undefined) throw new Error('give the highest input voltage');
    const base: FinderRequest = {
      maxInputVolts: form.maxInputV,
      ...converterLoad.value,
      maxRatioErrorFraction: form.tolerancePct === undefined ? undefined : form.tolerancePct / 100,
      minTopCount: form.minTop,
      maxTopCount: form.maxTop,
      mixedTopStrings: form.mixed,
      maxCandidates: 25,
      limits: {
        maxVoltsPerResistor: form.maxVoltsPerResistor,
        maxWattsPerResistor: form.maxWattsPerResistor,
        maxBleedAmps: form.maxBleedA,
        minTotalOhms: form.minTotalOhm,
        maxTotalOhms: form.maxTotalOhm,
        minOhms: form.minResistorOhm,
        maxOhms: form.maxResistorOhm,
      },
    };
    if (form.target === 'ratio') base.targetRatio = form.targetRatio;
    else base.fullScaleVolts = form.fullScaleV;
    if (form.source === 'series') {
      const stored = seriesStore.byName(form.series);
      if (!stored) throw new Error(`choose a stored series; "${form.series}" is not stored`);
      base.series = { name: stored.name, values: stored.values };
    }
    else {
      base.stock = stock.value.map((p) => ({
        ohms: p.ohms, quantity: p.quantity, maxVolts: p.ratedVoltageV ?? undefined, maxWatts: p.ratedPowerW ?? undefined,
      }));
    }
    return base;
  }

  async function search(): Promise<void> {
    searching.value = true;
    problem.value = null;
    try {
      if (form.source === 'stock') stock.value = await stockStore.loadAll();
      else await seriesStore.ensureLoaded();
      // Let the "searching" state paint before the (synchronous) search runs.
      await new Promise((resolve) => setTimeout(resolve, 0));
      result.value = findDividers(request());
      searched.value = { source: form.source, series: form.series };
    } catch (error) {
      result.value = null;
      problem.value = capitalise((error as Error).message);
    } finally {
      searching.value = false;
    }
  }

  /** A resistor of the chosen value: from stock its tolerance, TCR and ratings; from a series the old specs. */
  function resistorFor(ohms: number, template: ResistorDefinition, fromStock: boolean): ResistorDefinition {
    const part = fromStock ? stock.value.find((p) => p.ohms === ohms && p.quantity > 0) : undefined;
    if (!part) return { ...template, nominalOhm: ohms };
    return {
      ...template,
      nominalOhm: ohms,
      tolerancePct: part.tolerancePct,
      tcrPpmPerK: part.tcrPpmPerK,
      voltageCoefficientPpmPerV: part.voltageCoefficientPpmPerV,
      ratedVoltageV: part.ratedVoltageV ?? undefined,
      ratedPowerW: part.ratedPowerW ?? undefined,
    };
  }

  /** Fills the channel's divider with a candidate, in place. */
  function apply(candidate: DividerCandidate): void {
    const divider = channel().divider;
    const fromStock = searched.value.source === 'stock';
    const topTemplate = divider.top[0];
    divider.top = candidate.topOhms.map((ohms) => resistorFor(ohms, topTemplate, fromStock));
    divider.bottom = resistorFor(candidate.bottomOhms, divider.bottom, fromStock);
  }

  return { form, result, searched, converterLoad, problem, searching, onHand, search, apply };
}
