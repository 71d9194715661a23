import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { RunKind, RunState } from '../../shared/schemas/runs.js';
import { Revision } from './Revision.js';
import { User } from './User.js';

/** One study of a revision, run in the worker pool; the result is kept so reopening does not recompute. */
@Entity('analysis_runs')
@Index('IDX_analysis_runs_revision', ['revisionId', 'kind'])
export class AnalysisRun {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => Revision, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revisionId', foreignKeyConstraintName: 'FK_analysis_runs_revision' })
  revision: Revision;

  @Column('integer')
  revisionId: number;

  @Column('varchar', { length: 20 })
  kind: RunKind;

  @Column('simple-json')
  inputs: Record<string, unknown>;

  /** SHA-256 of the revision content the run used, to tell whether it is still current. */
  @Column('varchar', { length: 64 })
  inputsHash: string;

  @Column('integer')
  seed: number;

  @Column('integer', { nullable: true })
  trials: number | null;

  @Column('integer', { nullable: true })
  adaptiveDigits: number | null;

  @Index('IDX_analysis_runs_state')
  @Column('varchar', { length: 12, default: 'queued' })
  state: RunState;

  @Column('real', { default: 0 })
  progress: number;

  @Column('simple-json', { nullable: true })
  result: Record<string, unknown> | null;

  @Column('text', { nullable: true })
  error: string | null;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'requestedById', foreignKeyConstraintName: 'FK_analysis_runs_requested_by' })
  requestedBy: User;

  @Column('integer')
  requestedById: number;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  @Column('datetime', { nullable: true })
  startedAt: Date | null;

  @Column('datetime', { nullable: true })
  finishedAt: Date | null;

  @Column('integer', { nullable: true })
  durationMs: number | null;
}
