import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn, UpdateDateColumn } from 'typeorm';

/** A resistor the team has on the shelf. */
@Entity('stock_parts')
export class StockPart {
  @PrimaryGeneratedColumn()
  id: number;

  @Index('IDX_stock_parts_ohms')
  @Column('real')
  ohms: number;

  @Column('real')
  tolerancePct: number;

  @Column('real', { default: 0 })
  tcrPpmPerK: number;

  @Column('real', { default: 0 })
  voltageCoefficientPpmPerV: number;

  @Column('real', { nullable: true })
  ratedVoltageV: number | null;

  @Column('real', { nullable: true })
  ratedPowerW: number | null;

  @Column('varchar', { length: 40, default: '' })
  package: string;

  @Column('integer', { default: 0 })
  quantity: number;

  @Column('varchar', { length: 500, default: '' })
  note: string;

  @CreateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  createdAt: Date;

  @UpdateDateColumn({ type: 'datetime', default: () => 'CURRENT_TIMESTAMP' })
  updatedAt: Date;
}
