import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { CalibrationSession } from './CalibrationSession.js';

/** One bench pair; an excluded point is kept with its reason, never deleted. */
@Entity('calibration_points')
@Index('IDX_calibration_points_session', ['sessionId', 'position'])
export class CalibrationPoint {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => CalibrationSession, (s) => s.points, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'sessionId', foreignKeyConstraintName: 'FK_calibration_points_session' })
  session: CalibrationSession;

  @Column('integer')
  sessionId: number;

  @Column('integer')
  position: number;

  @Column('real')
  appliedV: number;

  @Column('real')
  frequencyHz: number;

  @Column('integer', { nullable: true })
  counts: number | null;

  @Column('real', { nullable: true })
  uncertaintyHz: number | null;

  @Column('boolean', { default: false })
  excluded: boolean;

  @Column('varchar', { length: 300, default: '' })
  excludedReason: string;
}
