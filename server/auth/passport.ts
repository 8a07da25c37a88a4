import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request } from 'express';
import type { User } from '../../shared/schemas/auth';
import type { AppDeps } from '../deps';
import type { SqliteSessionStore } from './session-store';
import { activeUser, authenticate } from '../services/auth';

/** One Passport instance per app, so several apps (tests) never share strategies. */
export function createPassport(deps: AppDeps, sessions?: SqliteSessionStore) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      authenticate(deps, email, password)
        .then((user) => done(null, user ?? false))
        .catch(done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // false for a deactivated or deleted account: passport then drops the login from the session.
  // The account is usually read with the session row (the store's `accountOf`); three parameters
  // make passport hand over the request.
  passport.deserializeUser((req: Request, id: number, done: (err: unknown, user?: User | false) => void) => {
    const known = sessions?.accountOf(req.sessionID, id);
    if (known !== undefined) return done(null, known ?? false);
    activeUser(deps, id)
      .then((user) => done(null, user ?? false))
      .catch(done);
  });
  return passport;
}
