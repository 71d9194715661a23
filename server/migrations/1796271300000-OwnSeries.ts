import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';
import { E_SERIES_MANTISSAS } from './e-series-seed.js';
import { booleanDefault, changeVarcharLength } from './portable.js';

/**
 * A team's own named series beside the IEC 60063 ones: longer names, and a flag that keeps the standard rows
 * read-only. Writes the IEC 60063 rows here, with the table's final columns (inserts go through the entity's
 * metadata, so an earlier migration cannot write them once the entity has grown); a database seeded by an
 * earlier version keeps its rows and gets them marked standard.
 */
export class OwnSeries1796271300000 implements MigrationInterface {
  name = 'OwnSeries1796271300000';

  async up(q: QueryRunner): Promise<void> {
    await changeVarcharLength(q, 'resistor_series', { name: 'name', type: 'varchar', length: '40', isPrimary: true });
    await q.addColumn('resistor_series', new TableColumn({ name: 'standard', type: 'boolean', default: booleanDefault(q, false) }));
    for (const [name, values] of Object.entries(E_SERIES_MANTISSAS)) {
      const row = { valuesPerDecade: values.length, values: [...values], standard: true }; // the entity's simple-json column writes the list
      const updated = await q.manager.createQueryBuilder().update('resistor_series').set(row).where('name = :name', { name }).execute();
      if (!updated.affected) await q.manager.createQueryBuilder().insert().into('resistor_series').values({ name, ...row }).execute();
    }
  }

  async down(q: QueryRunner): Promise<void> {
    await q.manager.createQueryBuilder().delete().from('resistor_series').where('standard = :no', { no: false }).execute();
    await q.dropColumn('resistor_series', 'standard');
    await changeVarcharLength(q, 'resistor_series', { name: 'name', type: 'varchar', length: '8', isPrimary: true });
  }
}
