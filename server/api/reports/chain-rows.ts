import type { ChannelDefinition } from '../../../shared/schemas/chain.js';
import { formatEng } from '../../../shared/units/index.js';

import type { ReportChainRow as ChainRow, ReportChainStage as ChainStage } from '../../../shared/schemas/report-views.js';

/** Units that take SI prefixes; the others (%, ppm, °C, counts) are printed plainly. */
const SI_UNITS = new Set(['Ω', 'V', 'Hz', 'Hz/V', 'A', 's', 'W', 'Bd', 'F']);

const plain = (v: number) => String(Number(v.toPrecision(6)));

function row(label: string, value: number | string | undefined, unit = ''): ChainRow | null {
  if (value === undefined) return null;
  if (typeof value === 'string') return { label, value, unit, text: value };
  const text = SI_UNITS.has(unit) ? formatEng(value, unit, 4) : `${plain(value)}${unit ? ` ${unit}` : ''}`;
  return { label, value, unit, text };
}

const rows = (...list: (ChainRow | null)[]) => list.filter((r): r is ChainRow => r !== null);

function resistorRows(prefix: string, r: ChannelDefinition['divider']['bottom']): ChainRow[] {
  return rows(
    row(`${prefix} resistance`, r.nominalOhm, 'Ω'),
    row(`${prefix} tolerance (${r.toleranceDistribution})`, r.tolerancePct, '%'),
    row(`${prefix} TCR`, r.tcrPpmPerK, 'ppm/K'),
    row(`${prefix} voltage coefficient`, r.voltageCoefficientPpmPerV, 'ppm/V'),
    row(`${prefix} rated voltage`, r.ratedVoltageV, 'V'),
    row(`${prefix} rated power`, r.ratedPowerW, 'W'),
    r.thermalResistanceKPerW ? row(`${prefix} thermal resistance`, r.thermalResistanceKPerW, 'K/W') : null,
  );
}

/** Every stage parameter of a channel, in signal order, with units. */
export function chainStages(c: ChannelDefinition): ChainStage[] {
  const stages: ChainStage[] = [
    { stage: 'Range', rows: rows(row('minimum', c.rangeV.minV, 'V'), row('maximum', c.rangeV.maxV, 'V')) },
    {
      stage: 'Divider',
      rows: [
        ...c.divider.top.flatMap((r, i) => resistorRows(`top R${i + 1}`, r)),
        ...resistorRows('bottom', c.divider.bottom),
        ...rows(row('derating limit', c.divider.deratingFraction * 100, '%')),
      ],
    },
    {
      stage: 'V/F converter',
      rows: rows(
        row('gain', c.converter.gainHzPerV, 'Hz/V'), row('offset', c.converter.offsetHz, 'Hz'), row('gain error', c.converter.gainErrorPct, '%'),
        row('offset error', c.converter.offsetErrorHz, 'Hz'), row('gain tempco', c.converter.gainTempcoPpmPerK, 'ppm/K'),
        row('offset drift', c.converter.offsetDriftHzPerK, 'Hz/K'), row('nonlinearity', c.converter.nonlinearityPctFs, '% FS'),
        row('full scale', c.converter.fullScaleHz, 'Hz'), row('input resistance', c.converter.inputResistanceOhm, 'Ω'),
        row('input resistance tolerance', c.converter.inputResistanceOhm === undefined ? undefined : c.converter.inputResistanceTolerancePct ?? 0, '%'),
        row('input resistance tempco', c.converter.inputResistanceOhm === undefined ? undefined : c.converter.inputResistanceTempcoPpmPerK ?? 0, 'ppm/K'),
        row('input bias current', c.converter.inputBiasCurrentA, 'A'),
      ),
    },
  ];
  if (c.isolator) {
    const i = c.isolator;
    stages.push({
      stage: 'Isolator',
      rows: rows(row('signalling rate', i.maxSignalRateBd, 'Bd'), row('pulse-width distortion', i.pulseWidthDistortionS, 's'),
        row('rated working voltage', i.ratedWorkingVoltageV, 'V'), row('rated insulation test voltage', i.ratedTestVoltageV, 'V'),
        row('creepage provided', i.creepageMm, 'mm'), row('clearance provided', i.clearanceMm, 'mm'), row('standard or rules followed', i.isolationRule),
        row('required creepage', i.requiredCreepageMm, 'mm'), row('required clearance', i.requiredClearanceMm, 'mm'),
        row('required insulation test voltage', i.requiredTestVoltageV, 'V')),
    });
  }
  const cap = c.capture;
  stages.push({
    stage: 'Timer capture',
    rows: cap.method === 'period'
      ? rows(row('method', 'period capture'), row('timer clock', cap.clockHz, 'Hz'), row('prescaler', cap.prescaler), row('periods averaged', cap.periodsAveraged),
        row('counter width', cap.counterBits, 'bit'), row('clock tolerance', cap.clockTolerancePpm, 'ppm'))
      : rows(row('method', 'gated count'), row('gate time', cap.gateS, 's'), row('counter width', cap.counterBits, 'bit'), row('clock tolerance', cap.clockTolerancePpm, 'ppm')),
  });
  const rec = c.reconstruction;
  stages.push({
    stage: 'Reading back',
    rows: rec.mode === 'nominal'
      ? rows(row('coefficients', 'design values'))
      : rows(row('coefficients', 'each board calibrated (two points)'), row('calibration temperature', rec.temperatureC, '°C'),
        rec.pointsV ? row('calibration points', `${formatEng(rec.pointsV[0], 'V')} and ${formatEng(rec.pointsV[1], 'V')}`) : null,
        row('gain uncertainty', rec.gainUncertaintyFraction * 100, '%'), row('offset uncertainty', rec.offsetUncertaintyV, 'V'),
        row('coverage factor', rec.coverageFactor)),
  });
  stages.push({ stage: 'Environment', rows: rows(row('minimum temperature', c.environment.minC, '°C'), row('maximum temperature', c.environment.maxC, '°C'), row('reference temperature', c.environment.referenceC, '°C')) });
  return stages;
}
