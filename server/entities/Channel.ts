import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { ChannelDefinition } from '../../shared/schemas/chain.js';
import { Revision } from './Revision.js';

/** One measured node of a revision (pack side, link side) with its whole chain as a validated snapshot. */
@Entity('channels')
@Index('IDX_channels_revision_key', ['revisionId', 'key'], { unique: true })
export class Channel {
  @PrimaryGeneratedColumn()
  id: number;

  @ManyToOne(() => Revision, (r) => r.channels, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'revisionId', foreignKeyConstraintName: 'FK_channels_revision' })
  revision: Revision;

  @Column('integer')
  revisionId: number;

  /** Stable short name used in URLs and exports, e.g. `pack`, `link`. */
  @Column('varchar', { length: 40 })
  key: string;

  @Column('integer', { default: 0 })
  position: number;

  @Column('simple-json')
  definition: ChannelDefinition;
}
