const STAGES: Record<string, string> = {
  rangeV: 'Range',
  divider: 'Divider',
  converter: 'V/F converter',
  isolator: 'Isolator',
  capture: 'Timer capture',
  environment: 'Environment',
  reconstruction: 'Reading back',
  name: 'Channel name',
};

/** Where a field sits, in words: `divider.top.1.nominalOhm` → "Divider, top resistor 2". */
export function describeFieldPath(path: string): string {
  const [stage, ...rest] = path.split('.');
  const words = [STAGES[stage] ?? stage];
  if (stage === 'divider' && rest[0] === 'top' && rest[1] !== undefined && /^\d+$/.test(rest[1])) words.push(`top resistor ${Number(rest[1]) + 1}`);
  else if (stage === 'divider' && rest[0] === 'bottom') words.push('bottom resistor');
  return words.join(', ');
}
