import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from './User.js';

/** A one-time password-reset link; only the SHA-256 of its token is kept, like an invitation's. */
@Entity('password_reset_tokens')
export class PasswordResetToken {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_password_reset_tokens_hash', { unique: true })
  @Column('varchar', { length: 64 })
  tokenHash: string;

  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId', foreignKeyConstraintName: 'FK_password_reset_tokens_user' })
  user: User;

  @Index('IDX_password_reset_tokens_user')
  @Column('integer')
  userId: number;

  @Column('datetime')
  expiresAt: Date;

  @Column('datetime', { nullable: true })
  usedAt: Date | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;
}
