import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

@Entity('audit_events')
export class AuditEvent {
  @PrimaryGeneratedColumn()
  id: number;

  /** Null for actions taken by nobody signed in (e.g. accepting an invitation before the account exists). */
  @Column('integer', { nullable: true })
  actorId: number | null;

  @Column('varchar', { length: 64 })
  action: string;

  @Index('IDX_audit_events_subject')
  @Column('varchar', { length: 120 })
  subject: string;

  @Column('simple-json', { nullable: true })
  detail: Record<string, unknown> | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  at: Date;
}
