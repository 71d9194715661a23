import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/schemas/roles.js';

@Entity('users')
export class User {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_users_email', { unique: true })
  @Column('varchar', { length: 254 })
  email: string;

  @Column('varchar', { length: 120 })
  displayName: string;

  @Column('varchar', { length: 16 })
  role: Role;

  @Column('varchar', { length: 100 })
  passwordHash: string;

  @Column('boolean', { default: true })
  active: boolean;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;
}
