import type { PublicUser } from '../../../shared/schemas/users.js';
import type { User } from '../../entities/User.js';
import { isoTime } from '../../common/iso-time.js';

export function toPublicUser(user: User): PublicUser {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    active: user.active,
    createdAt: isoTime(user.createdAt),
  };
}
