import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { CalibrationSession } from './CalibrationSession.js';
import { User } from './User.js';

/**
 * What a completed calibration session handed to firmware, frozen: the export payload as canonical JSON and its
 * SHA-256. Rows are only ever inserted; completing a reopened session adds the next sequence number.
 */
@Entity('calibration_records')
@Index('IDX_calibration_records_session_sequence', ['sessionId', 'sequence'], { unique: true })
export class CalibrationRecord {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => CalibrationSession, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'sessionId', foreignKeyConstraintName: 'FK_calibration_records_session' })
  session: CalibrationSession;

  @Column('integer')
  sessionId: number;

  /** 1 for the first completion of the session, then one more for each completion after a reopen. */
  @Column('integer')
  sequence: number;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'createdById', foreignKeyConstraintName: 'FK_calibration_records_created_by' })
  createdBy: User;

  @Column('integer')
  createdById: number;

  /** Set by the service to the same instant as the payload's frozenAt. */
  @Column('datetime', { default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  /** The canonical JSON text exactly as hashed. */
  @Column('text')
  payload: string;

  /** SHA-256 of the payload's UTF-8 bytes, lower-case hex. */
  @Column('varchar', { length: 64 })
  sha256: string;
}
