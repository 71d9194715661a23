import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/schemas/roles.js';
import { User } from './User.js';

/** A one-time invitation; only the SHA-256 of the token is kept, so a database leak reveals no usable link. */
@Entity('invite_tokens')
export class InviteToken {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_invite_tokens_hash', { unique: true })
  @Column('varchar', { length: 64 })
  tokenHash: string;

  @Column('varchar', { length: 254 })
  email: string;

  @Column('varchar', { length: 16 })
  role: Role;

  @Column('datetime')
  expiresAt: Date;

  @Column('datetime', { nullable: true })
  usedAt: Date | null;

  @ManyToOne(() => User, { nullable: true, onDelete: 'SET NULL' })
  @JoinColumn({ name: 'invitedById', foreignKeyConstraintName: 'FK_invite_tokens_invited_by' })
  invitedBy: User | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;
}
