import type { EntityManager } from 'typeorm';
import type { StockPartBody } from '../../../shared/schemas/stock.js';
import type { StockDuplicate } from '../../../shared/schemas/stock-views.js';
import { StockPart } from '../../entities/StockPart.js';

/**
 * A shelf line is "the same part" when value, tolerance and package agree. Values are compared to 1 ppm so
 * that "4K7" and "4.7k" (and a value that went through the CSV download) meet; packages ignore case and spaces.
 */
const sameOhms = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(Math.abs(a), Math.abs(b));
const packageKey = (p: string) => p.trim().toLowerCase();

type Shelf = Pick<StockPart, 'id' | 'ohms' | 'tolerancePct' | 'package' | 'quantity'>;

async function readShelf(m: EntityManager): Promise<Map<string, Shelf[]>> {
  const parts = await m.getRepository(StockPart).find({ select: { id: true, ohms: true, tolerancePct: true, package: true, quantity: true }, order: { id: 'ASC' } });
  const byKey = new Map<string, Shelf[]>();
  for (const p of parts) {
    const key = `${p.tolerancePct}|${packageKey(p.package)}`;
    byKey.set(key, [...(byKey.get(key) ?? []), p]);
  }
  return byKey;
}

/** For each readable row, the shelf line it duplicates (the oldest, when several do), by file row number. */
export async function findStockDuplicates(
  m: EntityManager, rows: { row: number; part: StockPartBody | null }[],
): Promise<StockDuplicate[]> {
  const shelf = await readShelf(m);
  const found: StockDuplicate[] = [];
  for (const { row, part } of rows) {
    if (!part) continue;
    const line = shelf.get(`${part.tolerancePct}|${packageKey(part.package ?? '')}`)?.find((p) => sameOhms(p.ohms, part.ohms));
    if (line) found.push({ row, partId: line.id, quantityOnShelf: line.quantity });
  }
  return found;
}

/** Adds each duplicate row's quantity to its shelf line; returns how many lines changed. Runs in the caller's transaction. */
export async function addToShelfLines(m: EntityManager, additions: { partId: number; quantity: number }[]): Promise<number> {
  const repo = m.getRepository(StockPart);
  const byLine = new Map<number, number>();
  for (const a of additions) byLine.set(a.partId, (byLine.get(a.partId) ?? 0) + a.quantity);
  for (const [id, quantity] of byLine) await repo.increment({ id }, 'quantity', quantity);
  return byLine.size;
}
