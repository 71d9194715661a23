import { TableColumn, type MigrationInterface, type QueryRunner } from 'typeorm';

/** The state of a board's revision when the board was recorded, so a board built to a draft says so later (null on older boards). */
export class BoardBuildState1796274100000 implements MigrationInterface {
  name = 'BoardBuildState1796274100000';

  async up(q: QueryRunner): Promise<void> {
    await q.addColumn('boards', new TableColumn({ name: 'revisionStateAtBuild', type: 'varchar', length: '20', isNullable: true }));
  }

  async down(q: QueryRunner): Promise<void> {
    await q.dropColumn('boards', 'revisionStateAtBuild');
  }
}
