import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';

/** A message received by the in-process SMTP fake; what a real mail server would have delivered. */
@Entity('outbox_messages')
export class OutboxMessage {
  @PrimaryGeneratedColumn()
  id: number;

  @Column('varchar', { length: 1000 })
  to: string;

  @Column('varchar', { length: 254 })
  from: string;

  @Column('varchar', { length: 500 })
  subject: string;

  @Column('text')
  text: string;

  @Column('text', { nullable: true })
  html: string | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  receivedAt: Date;
}
