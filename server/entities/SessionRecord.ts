import type { ISession } from 'connect-typeorm';
import { Column, DeleteDateColumn, Entity, Index, PrimaryColumn } from 'typeorm';

@Entity('sessions')
export class SessionRecord implements ISession {
  @Index('IDX_sessions_expired_at')
  @Column('bigint')
  expiredAt = Date.now();

  @PrimaryColumn('varchar', { length: 255 })
  id = '';

  @Column('text')
  json = '';

  @DeleteDateColumn({ type: 'datetime', nullable: true })
  destroyedAt?: Date;
}
