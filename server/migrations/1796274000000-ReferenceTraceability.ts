import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';

/** A calibration session's reference instrument identifier, certificate number and calibration due date (null on older sessions). */
export class ReferenceTraceability1796274000000 implements MigrationInterface {
  name = 'ReferenceTraceability1796274000000';

  async up(q: QueryRunner): Promise<void> {
    await q.addColumns('calibration_sessions', [
      new TableColumn({ name: 'referenceInstrumentId', type: 'varchar', length: '80', isNullable: true }),
      new TableColumn({ name: 'referenceCertificate', type: 'varchar', length: '80', isNullable: true }),
      new TableColumn({ name: 'referenceDueOn', type: 'varchar', length: '10', isNullable: true }),
    ]);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const name of ['referenceDueOn', 'referenceCertificate', 'referenceInstrumentId']) await q.dropColumn('calibration_sessions', name);
  }
}
