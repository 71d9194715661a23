import type { DataSource, EntityManager, FindOptionsWhere } from 'typeorm';
import { Between } from 'typeorm';
import { STOCK_PART_LIMIT, type StockPartBody } from '../../../shared/schemas/stock.js';
import { parseEngineering } from '../../../shared/units/index.js';
import { recordAudit } from '../../common/audit.js';
import { importableRows } from '../../common/csv.js';
import { BadRequestError, ConflictError, NotFoundError } from '../../common/errors.js';
import { StockPart } from '../../entities/StockPart.js';
import type { User } from '../../entities/User.js';
import type { StockDuplicateChoice, StockPreview } from '../../../shared/schemas/stock-views.js';
import { addToShelfLines, findStockDuplicates } from './stock-duplicates.js';

export interface StockListOptions {
  page: number;
  pageSize: number;
  sort: 'ohms' | 'tolerancePct' | 'quantity' | 'updatedAt';
  order: 'asc' | 'desc';
  search?: string;
}

/** Search is by value: "4k7" or "4.7k" finds parts within ±0.5 % of 4.7 kΩ. */
function searchWhere(search: string | undefined): FindOptionsWhere<StockPart> | undefined {
  if (!search) return undefined;
  let ohms: number;
  try {
    ohms = parseEngineering(search, 'Ω');
  } catch (err) {
    throw new BadRequestError(`search: ${(err as Error).message}`, { search: (err as Error).message });
  }
  return { ohms: Between(ohms * 0.995, ohms * 1.005) };
}

export async function listStock(dataSource: DataSource, o: StockListOptions) {
  const [items, total] = await dataSource.getRepository(StockPart).findAndCount({
    where: searchWhere(o.search),
    order: { [o.sort]: o.order.toUpperCase(), id: 'ASC' },
    skip: (o.page - 1) * o.pageSize,
    take: o.pageSize,
  });
  return { items, total };
}

/**
 * The whole stock in value order, a page at a time: each page is read only when the caller asks for it,
 * and keyed on the last row read (not an offset), so a page costs the same however far in it is.
 */
export async function* stockInPages(dataSource: DataSource, pageSize = 500): AsyncGenerator<StockPart[]> {
  let last: StockPart | undefined;
  for (;;) {
    const query = dataSource.getRepository(StockPart).createQueryBuilder('p').orderBy('p.ohms', 'ASC').addOrderBy('p.id', 'ASC').limit(pageSize);
    if (last) query.where('p.ohms > :ohms OR (p.ohms = :ohms AND p.id > :id)', { ohms: last.ohms, id: last.id });
    const page = await query.getMany();
    if (page.length === 0) return;
    yield page;
    if (page.length < pageSize) return;
    last = page[page.length - 1];
  }
}

/** How many more parts the stock takes. */
export async function stockRoom(m: DataSource | EntityManager): Promise<number> {
  return Math.max(0, STOCK_PART_LIMIT - (await m.getRepository(StockPart).count()));
}

/** Refuses, inside the writing transaction, a change that would take the stock past its limit. */
async function assertRoom(m: EntityManager, adding: number, source: 'file' | 'part'): Promise<void> {
  const room = await stockRoom(m);
  if (adding <= room) return;
  const what = source === 'file' ? `this file adds ${adding}, so nothing was imported` : 'so this part was not added';
  throw new ConflictError(
    `the stock holds at most ${STOCK_PART_LIMIT} parts and has room for ${room}; ${what}. Delete parts no longer on the shelf first`,
    source === 'file' ? { file: `room for ${room} of ${STOCK_PART_LIMIT} parts` } : undefined,
  );
}

export async function createStockPart(dataSource: DataSource, actor: User, body: StockPartBody): Promise<StockPart> {
  return dataSource.transaction(async (m) => {
    await assertRoom(m, 1, 'part');
    const part = await m.getRepository(StockPart).save(m.getRepository(StockPart).create(body));
    await recordAudit(m, actor.id, 'stock.create', `stock:${part.id}`, { ohms: part.ohms });
    return part;
  });
}

export async function updateStockPart(dataSource: DataSource, actor: User, id: number, patch: Partial<StockPartBody>): Promise<StockPart> {
  return dataSource.transaction(async (m) => {
    const repo = m.getRepository(StockPart);
    const part = await repo.findOneBy({ id });
    if (!part) throw new NotFoundError(`no stock part with id ${id}`);
    Object.assign(part, patch);
    await repo.save(part);
    await recordAudit(m, actor.id, 'stock.update', `stock:${id}`, patch as Record<string, unknown>);
    return part;
  });
}

export async function deleteStockPart(dataSource: DataSource, actor: User, id: number): Promise<void> {
  await dataSource.transaction(async (m) => {
    const result = await m.getRepository(StockPart).delete({ id });
    if (!result.affected) throw new NotFoundError(`no stock part with id ${id}`);
    await recordAudit(m, actor.id, 'stock.delete', `stock:${id}`);
  });
}

/**
 * Fault injection for the crash test only: with TALLYVOLT_FAULT_PAUSE_IMPORT_MS set, an import stops
 * after its first chunk (inside the transaction) and says so, so the test can kill the process right there.
 */
async function faultPause(): Promise<void> {
  const ms = Number(process.env.TALLYVOLT_FAULT_PAUSE_IMPORT_MS);
  if (!(ms > 0)) return;
  console.log('[fault] import paused inside its transaction');
  await new Promise((resolve) => setTimeout(resolve, ms));
}

/** The preview's view of the shelf: room left and the rows that repeat a line already there. */
export async function stockPreviewShelf(dataSource: DataSource, rows: StockPreview['rows']): Promise<Pick<StockPreview, 'room' | 'duplicates'>> {
  return dataSource.transaction(async (m) => ({ room: await stockRoom(m), duplicates: await findStockDuplicates(m, rows) }));
}

/**
 * Stores the previewed rows in one transaction: all of them, or only the valid ones when the person chose so.
 * With `onlyValid` false, any bad row refuses the whole file and nothing is stored. With 'add-quantity', a row
 * already on the shelf adds its quantity to that line instead of becoming a second line; the match is made
 * again inside the transaction, so it reflects the shelf as it is when the import runs.
 */
export async function importStock(
  dataSource: DataSource, actor: User, preview: Pick<StockPreview, 'rows' | 'invalidCount'>, onlyValid: boolean,
  duplicateChoice: StockDuplicateChoice = 'new-line',
): Promise<{ imported: number; addedTo: number }> {
  importableRows(preview.rows.map((r) => r.part), onlyValid);
  return dataSource.transaction(async (m) => {
    const duplicates = duplicateChoice === 'add-quantity' ? await findStockDuplicates(m, preview.rows) : [];
    const lineOf = new Map(duplicates.map((d) => [d.row, d.partId]));
    const parts = preview.rows.filter((r) => r.part && !lineOf.has(r.row)).map((r) => r.part!);
    const additions = preview.rows.filter((r) => r.part && lineOf.has(r.row)).map((r) => ({ partId: lineOf.get(r.row)!, quantity: r.part!.quantity ?? 0 }));
    await assertRoom(m, parts.length, 'file');
    const repo = m.getRepository(StockPart);
    // Chunked inserts keep each statement under SQLite's variable limit.
    for (let i = 0; i < parts.length; i += 200) {
      await repo.insert(parts.slice(i, i + 200).map((p) => repo.create(p)));
      if (i === 0) await faultPause();
    }
    const addedTo = await addToShelfLines(m, additions);
    await recordAudit(m, actor.id, 'stock.import', 'stock', { rows: parts.length, addedTo, skipped: preview.invalidCount });
    return { imported: parts.length, addedTo };
  });
}
