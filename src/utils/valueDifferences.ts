/** One leaf value that differs between a person's unsaved copy and the saved one. */
export interface ValueDifference {
  /** Dotted path of the leaf, e.g. `0.definition.divider.bottom.nominalOhm`. */
  path: string;
  mine: unknown;
  theirs: unknown;
}

function collect(value: unknown, path: string, out: Map<string, unknown>): void {
  if (value !== null && typeof value === 'object') {
    const entries = Array.isArray(value) ? value.map((v, i) => [String(i), v] as const) : Object.entries(value);
    if (entries.length === 0) out.set(path, value);
    for (const [key, child] of entries) collect(child, path ? `${path}.${key}` : key, out);
    return;
  }
  if (value !== undefined) out.set(path, value);
}

/** Every leaf where two plain-data copies differ, in the order the first copy lists them, then the second's extras. */
export function valueDifferences(mine: unknown, theirs: unknown): ValueDifference[] {
  const a = new Map<string, unknown>();
  const b = new Map<string, unknown>();
  collect(mine, '', a);
  collect(theirs, '', b);
  const paths = [...a.keys(), ...[...b.keys()].filter((p) => !a.has(p))];
  return paths
    .filter((p) => JSON.stringify(a.get(p)) !== JSON.stringify(b.get(p)))
    .map((path) => ({ path, mine: a.get(path), theirs: b.get(path) }));
}

/** One line of the kept-changes list: where, the person's unsaved value, the saved one. */
export interface KeptRow {
  label: string;
  mine: string;
  theirs: string;
}

// Units read off the field names' suffixes (the house names every quantity with its unit).
const UNITS: [RegExp, string][] = [
  [/PpmPerK$/, 'ppm/K'], [/PpmPerV$/, 'ppm/V'], [/KPerW$/, 'K/W'], [/HzPerV$/, 'Hz/V'], [/HzPerK$/, 'Hz/K'], [/Ohm$/, 'Ω'],
  [/Hz$/, 'Hz'], [/Pct$/, '%'], [/PctFs$/, '% FS'], [/V$/, 'V'], [/W$/, 'W'], [/F$/, 'F'], [/A$/, 'A'], [/C$/, '°C'], [/S$/, 's'],
];

/** A leaf value as text, exactly as stored (no rounding: a person compares it with what they typed), with its unit. */
export function plainValue(value: unknown, path = ''): string {
  if (value === undefined || value === null || value === '') return '—';
  if (typeof value === 'object') return JSON.stringify(value);
  const leaf = path.split('.').at(-1) ?? '';
  const unit = typeof value === 'number' ? UNITS.find(([suffix]) => suffix.test(leaf))?.[1] : undefined;
  return unit ? `${value} ${unit}` : String(value);
}

/** The leaf value at a dotted path, or undefined. */
export function leafAt(value: unknown, path: string): unknown {
  let node = value;
  for (const part of path.split('.')) {
    if (node === null || typeof node !== 'object') return undefined;
    node = (node as Record<string, unknown>)[part];
  }
  return node;
}

const isEmptyObject = (v: unknown) => v !== null && typeof v === 'object' && !Array.isArray(v) && Object.keys(v).length === 0;

function compact(node: unknown): void {
  if (node === null || typeof node !== 'object') return;
  for (const child of Object.values(node)) compact(child);
  if (Array.isArray(node)) {
    for (let i = node.length - 1; i >= 0; i--) if (node[i] === undefined || isEmptyObject(node[i])) node.splice(i, 1);
  }
}

/**
 * Applies one person's edits (differences from the version they started with) over a newer version: a
 * three-way re-base, so what someone else changed elsewhere stays and only the person's own changes move.
 * An entry removed by the edits (its value undefined) is removed; list entries left empty are dropped.
 */
export function applyDifferences<T>(target: T, edits: ValueDifference[]): T {
  const out = JSON.parse(JSON.stringify(target)) as Record<string, unknown>;
  for (const edit of edits) {
    const parts = edit.path.split('.');
    let node: Record<string, unknown> = out;
    for (let i = 0; i < parts.length - 1; i++) {
      const next = node[parts[i]];
      if (next === null || typeof next !== 'object') node[parts[i]] = /^\d+$/.test(parts[i + 1]) ? [] : {};
      node = node[parts[i]] as Record<string, unknown>;
    }
    const last = parts[parts.length - 1];
    if (edit.mine === undefined) delete node[last];
    else node[last] = JSON.parse(JSON.stringify(edit.mine));
  }
  compact(out);
  return out as T;
}
