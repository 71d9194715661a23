import type { DataSource, EntityManager } from 'typeorm';
import { importableRows } from '../../common/csv.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, NotFoundError } from '../../common/errors.js';
import { ResistorSeries } from '../../entities/ResistorSeries.js';
import type { User } from '../../entities/User.js';
import type { SeriesCreateBody } from '../../../shared/schemas/series.js';
import type { SeriesPreview } from '../../../shared/schemas/series-views.js';

/** Standard series first (coarsest first), then the team's own by name. */
export async function listSeries(dataSource: DataSource): Promise<ResistorSeries[]> {
  const all = await dataSource.getRepository(ResistorSeries).find();
  return all.sort((a, b) => Number(b.standard) - Number(a.standard)
    || (a.standard ? a.valuesPerDecade - b.valuesPerDecade : a.name.localeCompare(b.name)));
}

/** A stored series by name; the standard names are matched regardless of case (e24 is E24). */
async function findSeries(m: DataSource | EntityManager, name: string): Promise<ResistorSeries | null> {
  const repo = m.getRepository(ResistorSeries);
  return (await repo.findOneBy({ name })) ?? (await repo.findOneBy({ name: name.toUpperCase(), standard: true }));
}

export async function getSeries(dataSource: DataSource, name: string): Promise<ResistorSeries> {
  const series = await findSeries(dataSource, name);
  if (!series) throw new NotFoundError(`no series named "${name}"`);
  return series;
}

async function storeNew(m: EntityManager, actor: User, body: SeriesCreateBody, how: 'form' | 'csv'): Promise<ResistorSeries> {
  if (await findSeries(m, body.name)) throw new ConflictError(`a series named "${body.name}" is stored already`, { name: 'is taken by a stored series' });
  const repo = m.getRepository(ResistorSeries);
  const series = await repo.save(repo.create({ name: body.name, values: body.values, valuesPerDecade: body.values.length, standard: false }));
  await recordAudit(m, actor.id, 'series.create', `series:${series.name}`, { values: series.valuesPerDecade, from: how });
  return series;
}

export function createSeries(dataSource: DataSource, actor: User, body: SeriesCreateBody): Promise<ResistorSeries> {
  return dataSource.transaction((m) => storeNew(m, actor, body, 'form'));
}

/** The team's own series, for a change; the IEC 60063 rows are refused with the reason. */
async function ownSeries(m: EntityManager, name: string, verb: 'changed' | 'deleted'): Promise<ResistorSeries> {
  const series = await findSeries(m, name);
  if (!series) throw new NotFoundError(`no series named "${name}"`);
  if (series.standard) throw new ConflictError(`${series.name} is an IEC 60063 series and cannot be ${verb}; add a series of your own instead`, { name: 'is a read-only IEC 60063 series' });
  return series;
}

export function replaceSeriesValues(dataSource: DataSource, actor: User, name: string, values: number[]): Promise<ResistorSeries> {
  return dataSource.transaction(async (m) => {
    const series = await ownSeries(m, name, 'changed');
    Object.assign(series, { values, valuesPerDecade: values.length });
    await m.getRepository(ResistorSeries).save(series);
    await recordAudit(m, actor.id, 'series.update', `series:${series.name}`, { values: values.length });
    return series;
  });
}

export async function deleteSeries(dataSource: DataSource, actor: User, name: string): Promise<void> {
  await dataSource.transaction(async (m) => {
    const series = await ownSeries(m, name, 'deleted');
    await m.getRepository(ResistorSeries).delete({ name: series.name });
    await recordAudit(m, actor.id, 'series.delete', `series:${series.name}`);
  });
}

/**
 * Stores a previewed CSV as a new series in one transaction: all rows, or only the valid ones when the person chose so.
 * With `onlyValid` false, any bad row refuses the whole file and nothing is stored.
 */
export function importSeries(dataSource: DataSource, actor: User, preview: SeriesPreview, onlyValid: boolean): Promise<ResistorSeries> {
  const values = importableRows(preview.rows.map((r) => r.value), onlyValid).sort((a, b) => a - b);
  return dataSource.transaction((m) => storeNew(m, actor, { name: preview.name, values }, 'csv'));
}
