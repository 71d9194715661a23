import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { CalibrationState, FitSettings, ReferenceSpec } from '../../shared/schemas/calibration.js';
import { Board } from './Board.js';
import { User } from './User.js';
import type { CalibrationPoint } from './CalibrationPoint.js';

/** One bench calibration of one channel of a board. */
@Entity('calibration_sessions')
@Index('IDX_calibration_sessions_board', ['boardId', 'channelKey'])
export class CalibrationSession {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => Board, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'boardId', foreignKeyConstraintName: 'FK_calibration_sessions_board' })
  board: Board;

  @Column('integer')
  boardId: number;

  @Column('varchar', { length: 40 })
  channelKey: string;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'testerId', foreignKeyConstraintName: 'FK_calibration_sessions_tester' })
  tester: User;

  @Column('integer')
  testerId: number;

  @Column('varchar', { length: 10 })
  performedOn: string;

  @Column('real')
  ambientC: number;

  @Column('simple-json')
  reference: ReferenceSpec;

  /** The reference instrument's own identifier (asset tag); null when not recorded. */
  @Column('varchar', { length: 80, nullable: true })
  referenceInstrumentId: string | null;

  @Column('varchar', { length: 80, nullable: true })
  referenceCertificate: string | null;

  /** ISO date the reference's calibration falls due; a session performed after it is flagged. */
  @Column('varchar', { length: 10, nullable: true })
  referenceDueOn: string | null;

  @Column('simple-json')
  fit: FitSettings;

  @Column('text', { default: '' })
  note: string;

  @Column('varchar', { length: 12, default: 'draft' })
  state: CalibrationState;

  @Column('datetime', { nullable: true })
  completedAt: Date | null;

  @OneToMany('CalibrationPoint', (p: CalibrationPoint) => p.session)
  points: CalibrationPoint[];

  /** Up by one with every change of the points (replace, import, exclusion); a points save names the version it started from. */
  @Column('integer', { default: 1 })
  pointsVersion: number;

  @ManyToOne(() => User, { nullable: true, onDelete: 'SET NULL' })
  @JoinColumn({ name: 'pointsSavedById', foreignKeyConstraintName: 'FK_calibration_sessions_points_saved_by' })
  pointsSavedBy: User | null;

  @Column('integer', { nullable: true })
  pointsSavedById: number | null;

  @Column('datetime', { nullable: true })
  pointsSavedAt: Date | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  updatedAt: Date;
}
