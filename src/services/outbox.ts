import { http } from './http';
import type { OutboxList } from '@shared/schemas/admin-views';

export type { OutboxList, OutboxMessage } from '@shared/schemas/admin-views';

export const outboxApi = {
  list: () => http.get<OutboxList>('/api/outbox'),
};
