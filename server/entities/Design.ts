import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import { User } from './User.js';
import type { Revision } from './Revision.js';

/** A measurement-chain design; its content lives in revisions. */
@Entity('designs')
export class Design {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_designs_name')
  @Column('varchar', { length: 120 })
  name: string;

  @Column('text', { default: '' })
  purpose: string;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'ownerId', foreignKeyConstraintName: 'FK_designs_owner' })
  owner: User;

  @Column('integer')
  ownerId: number;

  @OneToMany('Revision', (r: Revision) => r.design)
  revisions: Revision[];

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  updatedAt: Date;
}
