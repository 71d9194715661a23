import type { DataSource } from 'typeorm';
import { OutboxMessage } from '../../entities/OutboxMessage.js';

export async function listOutbox(dataSource: DataSource, page: number, pageSize: number) {
  const [items, total] = await dataSource.getRepository(OutboxMessage).findAndCount({
    order: { receivedAt: 'DESC', id: 'DESC' },
    skip: (page - 1) * pageSize,
    take: pageSize,
  });
  return { items, total };
}
