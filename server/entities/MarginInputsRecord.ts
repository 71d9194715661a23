import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { MarginInputs } from '../../shared/schemas/margin.js';
import { Revision } from './Revision.js';
import { User } from './User.js';

/** The margin-study inputs of one revision (pack range, pre-charge parts, closing rule, fault cases). */
@Entity('margin_inputs')
@Index('IDX_margin_inputs_revision', ['revisionId'], { unique: true })
export class MarginInputsRecord {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => Revision, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revisionId', foreignKeyConstraintName: 'FK_margin_inputs_revision' })
  revision: Revision;

  @Column('integer')
  revisionId: number;

  @Column('simple-json')
  inputs: MarginInputs;

  /** Up by one with every save (1 for the first); 0 stands for "nothing stored" in the API. */
  @Column('integer', { default: 1 })
  version: number;

  @ManyToOne(() => User, { nullable: true, onDelete: 'SET NULL' })
  @JoinColumn({ name: 'updatedById', foreignKeyConstraintName: 'FK_margin_inputs_updated_by' })
  updatedBy: User | null;

  @Column('integer', { nullable: true })
  updatedById: number | null;

  @UpdateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  updatedAt: Date;
}
