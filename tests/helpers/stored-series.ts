import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { decadeValuesInRange } from '../../shared/eseries/index.js';
import type { SeriesValues } from '../../shared/finder/index.js';

/** IEC 60063 E3…E192 as tests/fixtures/e-series.json holds them (its `_source` names where they come from). */
export const eSeriesFixture = JSON.parse(
  readFileSync(fileURLToPath(new URL('../fixtures/e-series.json', import.meta.url)), 'utf8'),
) as Record<'E3' | 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192', number[]>;

export type FixtureSeriesName = 'E3' | 'E6' | 'E12' | 'E24' | 'E48' | 'E96' | 'E192';

/** A series as the finder takes it, with the fixture's values: what the client sends after reading the stored series. */
export const fixtureSeries = (name: FixtureSeriesName): SeriesValues => ({ name, values: eSeriesFixture[name] });

/** Every value of a fixture series from minOhms to maxOhms. */
export const fixtureValuesInRange = (name: FixtureSeriesName, minOhms: number, maxOhms: number): number[] =>
  decadeValuesInRange(eSeriesFixture[name], minOhms, maxOhms);
