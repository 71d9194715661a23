import { http } from './http';

export interface OutboxMessage {
  id: number;
  to: string;
  from: string;
  subject: string;
  receivedAt: string;
  text: string;
  html: string | null;
}

export interface OutboxList {
  items: OutboxMessage[];
  total: number;
}

export const outboxApi = {
  list: () => http.get<OutboxList>('/api/outbox'),
};
