import type { DataSource } from 'typeorm';
import { recordAudit } from '../common/audit.js';
import { hashPassword } from '../common/passwords.js';
import { User } from '../entities/User.js';
import { DEMO_USERS } from './demo-team.js';

/** Seeds the demo team into an empty database; a database with any user is left alone. */
export async function seedDemoIfEmpty(dataSource: DataSource): Promise<boolean> {
  if ((await dataSource.getRepository(User).count()) > 0) return false;
  const hashes = await Promise.all(DEMO_USERS.map((u) => hashPassword(u.password)));
  await dataSource.transaction(async (manager) => {
    const repo = manager.getRepository(User);
    for (const [i, u] of DEMO_USERS.entries()) {
      const user = await repo.save(repo.create({ email: u.email, displayName: u.displayName, role: u.role, passwordHash: hashes[i], active: true }));
      await recordAudit(manager, null, 'seed.user', `user:${user.id}`, { role: u.role });
    }
  });
  return true;
}
