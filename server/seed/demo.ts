import type { DataSource } from 'typeorm';
import { recordAudit } from '../common/audit.js';
import { hashPassword } from '../common/passwords.js';
import { User } from '../entities/User.js';
import { DEMO_USERS } from './demo-team.js';
import { seedDemoDesign } from './demo-design.js';
import { seedDemoCalibration } from './demo-calibration.js';

/** Seeds the demo team into an empty database; a database with any user is left alone. */
/** `team` seeds only the people (most API tests); `full` adds the demo design and stock. */
export type DemoSeed = 'team' | 'full';

export async function seedDemoIfEmpty(dataSource: DataSource, what: DemoSeed = 'full'): Promise<boolean> {
  if ((await dataSource.getRepository(User).count()) > 0) return false;
  const hashes = await Promise.all(DEMO_USERS.map((u) => hashPassword(u.password)));
  const users = await dataSource.transaction(async (manager) => {
    const repo = manager.getRepository(User);
    const saved: User[] = [];
    for (const [i, u] of DEMO_USERS.entries()) {
      const user = await repo.save(repo.create({ email: u.email, displayName: u.displayName, role: u.role, passwordHash: hashes[i], active: true }));
      await recordAudit(manager, null, 'seed.user', `user:${user.id}`, { role: u.role });
      saved.push(user);
    }
    return saved;
  });
  if (what === 'full') {
    const byRole = (role: string) => users.find((u) => u.role === role)!;
    await seedDemoDesign(dataSource, byRole('designer'), byRole('lead'));
    await seedDemoCalibration(dataSource, byRole('tester'));
  }
  return true;
}
