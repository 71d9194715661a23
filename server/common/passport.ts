import passport from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { User } from '../entities/User.js';
import { checkPassword, dummyHash, hashPassword } from './passwords.js';
import { userCacheFor } from './user-cache.js';

/** One message for unknown e-mail, wrong password and deactivated account, so none can be told apart. */
export const SIGN_IN_FAILED = 'e-mail or password is not right';

export function configurePassport(dataSource: DataSource): passport.PassportStatic {
  const users = dataSource.getRepository(User);
  const cache = userCacheFor(dataSource);
  const instance = new passport.Passport() as unknown as passport.PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, async (email, password, done) => {
      try {
        const user = await users.findOneBy({ email: email.trim().toLowerCase() });
        // One comparison at the real cost on every path (unknown, wrong, deactivated), so timing tells nothing.
        const { ok, stale } = await checkPassword(password, user?.passwordHash ?? (await dummyHash()));
        if (!user || !ok || !user.active) return done(null, false, { message: SIGN_IN_FAILED });
        if (stale) await users.update({ id: user.id }, { passwordHash: await hashPassword(password) });
        done(null, user);
      } catch (err) {
        done(err);
      }
    }),
  );
  instance.serializeUser((user, done) => done(null, (user as User).id));
  instance.deserializeUser(async (id: number, done) => {
    try {
      const cached = cache.get(id);
      const user = cached ?? (await users.findOneBy({ id }));
      if (user && !cached) cache.set(user);
      // A deactivated account loses its sessions at the next request.
      done(null, user && user.active ? user : false);
    } catch (err) {
      done(err);
    }
  });
  return instance;
}
