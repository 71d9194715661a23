import { Column, Entity, PrimaryColumn } from 'typeorm';

/** A named list of preferred values, one decade in [1, 10): an IEC 60063 series (standard, read-only) or the team's own. */
@Entity('resistor_series')
export class ResistorSeries {
  @PrimaryColumn('varchar', { length: 40 })
  name: string;

  @Column('integer')
  valuesPerDecade: number;

  @Column('simple-json')
  values: number[];

  /** seeded from IEC 60063 by migration; never edited or deleted through the API */
  @Column('boolean', { default: false })
  standard: boolean;
}
