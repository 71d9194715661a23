import type { DataSource } from 'typeorm';
import { NotFoundError } from '../../common/errors.js';
import { ResistorSeries } from '../../entities/ResistorSeries.js';

export const listSeries = (dataSource: DataSource) =>
  dataSource.getRepository(ResistorSeries).find({ order: { valuesPerDecade: 'ASC' } });

export async function getSeries(dataSource: DataSource, name: string): Promise<ResistorSeries> {
  const series = await dataSource.getRepository(ResistorSeries).findOneBy({ name: name.toUpperCase() });
  if (!series) throw new NotFoundError(`no series ${name}; the IEC 60063 series are E3, E6, E12, E24, E48, E96 and E192`);
  return series;
}
