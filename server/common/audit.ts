import type { EntityManager } from 'typeorm';
import { AuditEvent } from '../entities/AuditEvent.js';

/** Records who did what to which subject, inside the caller's transaction when given one. */
export async function recordAudit(
  manager: EntityManager,
  actorId: number | null,
  action: string,
  subject: string,
  detail: Record<string, unknown> | null = null,
): Promise<void> {
  const repo = manager.getRepository(AuditEvent);
  await repo.save(repo.create({ actorId, action, subject, detail }));
}
