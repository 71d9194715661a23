import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToMany, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';
import type { RevisionState } from '../../shared/schemas/designs.js';
import { Design } from './Design.js';
import { User } from './User.js';
import type { Channel } from './Channel.js';

/** One lettered revision of a design; only a draft may change. */
@Entity('revisions')
@Index('IDX_revisions_design_letter', ['designId', 'letter'], { unique: true })
export class Revision {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => Design, (d) => d.revisions, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'designId', foreignKeyConstraintName: 'FK_revisions_design' })
  design: Design;

  @Column('integer')
  designId: number;

  @Column('varchar', { length: 4 })
  letter: string;

  @Column('varchar', { length: 20, default: 'draft' })
  state: RevisionState;

  @Column('text', { default: '' })
  note: string;

  /** The revision this one was started from, if any. */
  @Column('integer', { nullable: true })
  basedOnId: number | null;

  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'createdById', foreignKeyConstraintName: 'FK_revisions_created_by' })
  createdBy: User;

  @Column('integer')
  createdById: number;

  @OneToMany('Channel', (c: Channel) => c.revision)
  channels: Channel[];

  /** Up by one with every saved change of the channels; a save names the version it started from. */
  @Column('integer', { default: 1 })
  version: number;

  @ManyToOne(() => User, { nullable: true, onDelete: 'SET NULL' })
  @JoinColumn({ name: 'updatedById', foreignKeyConstraintName: 'FK_revisions_updated_by' })
  updatedBy: User | null;

  /** Who saved the channels last; null until the first save after the revision was started. */
  @Column('integer', { nullable: true })
  updatedById: number | null;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  updatedAt: Date;
}
