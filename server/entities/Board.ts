import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { RevisionState } from '../../shared/schemas/designs.js';
import { Revision } from './Revision.js';
import { User } from './User.js';

/** One built board of a design revision, known by its serial number. */
@Entity('boards')
export class Board {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_boards_serial', { unique: true })
  @Column('varchar', { length: 40 })
  serialNumber: string;

  @ManyToOne(() => Revision, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'revisionId', foreignKeyConstraintName: 'FK_boards_revision' })
  revision: Revision;

  @Index('IDX_boards_revision')
  @Column('integer')
  revisionId: number;

  /** ISO date, e.g. 2026-11-20. */
  @Column('varchar', { length: 10 })
  buildDate: string;

  @Column('text', { default: '' })
  note: string;

  /** The revision's state when the board was recorded (null for boards recorded before it was kept). */
  @Column('varchar', { length: 20, nullable: true })
  revisionStateAtBuild: RevisionState | null;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'createdById', foreignKeyConstraintName: 'FK_boards_created_by' })
  createdBy: User;

  @Column('integer')
  createdById: number;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;
}
