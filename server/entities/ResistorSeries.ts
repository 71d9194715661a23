import { Column, Entity, PrimaryColumn } from 'typeorm';

/** An IEC 60063 series (E3…E192), one decade of values in [1, 10); read-only reference data. */
@Entity('resistor_series')
export class ResistorSeries {
  @PrimaryColumn('varchar', { length: 8 })
  name: string;

  @Column('integer')
  valuesPerDecade: number;

  @Column('simple-json')
  values: number[];
}
