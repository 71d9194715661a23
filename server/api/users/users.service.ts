import type { DataSource } from 'typeorm';
import type { UserPatchBody } from '../../../shared/schemas/users.js';
import { recordAudit } from '../../common/audit.js';
import { ConflictError, NotFoundError } from '../../common/errors.js';
import { User } from '../../entities/User.js';
import { userCacheFor } from '../../common/user-cache.js';
import { endSessionsOf } from '../../common/session.js';

export async function listUsers(dataSource: DataSource, page: number, pageSize: number) {
  const [items, total] = await dataSource.getRepository(User).findAndCount({
    order: { displayName: 'ASC' },
    skip: (page - 1) * pageSize,
    take: pageSize,
  });
  return { items, total };
}

/** Changes a role or the active flag; the last active admin can be neither demoted nor deactivated. */
export async function updateUser(dataSource: DataSource, actor: User, id: number, patch: UserPatchBody): Promise<User> {
  const updated = await dataSource.transaction(async (manager) => {
    const repo = manager.getRepository(User);
    const user = await repo.findOneBy({ id });
    if (!user) throw new NotFoundError(`no person with id ${id}`);
    const losesAdmin = user.role === 'admin' && user.active && ((patch.role && patch.role !== 'admin') || patch.active === false);
    if (losesAdmin && (await repo.countBy({ role: 'admin', active: true })) <= 1) {
      throw new ConflictError('this is the last active admin; make someone else admin first', {
        [patch.active === false ? 'active' : 'role']: 'would leave no active admin',
      });
    }
    const before = { role: user.role, active: user.active };
    if (patch.role) user.role = patch.role;
    if (patch.active !== undefined) user.active = patch.active;
    await repo.save(user);
    // Deactivation ends every session at once; otherwise one idle through it would work again after reactivation.
    if (patch.active === false) await endSessionsOf(manager, user.id);
    await recordAudit(manager, actor.id, 'user.update', `user:${user.id}`, { before, after: { role: user.role, active: user.active } });
    return user;
  });
  // After the commit, so no request can cache the row as it was before.
  userCacheFor(dataSource).forget(id);
  return updated;
}
