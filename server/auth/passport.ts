import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { AppDeps } from '../deps';
import { activeUser, authenticate } from '../services/auth';

/** One Passport instance per app, so several apps (tests) never share strategies. */
export function createPassport(deps: AppDeps) {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      authenticate(deps, email, password)
        .then((user) => done(null, user ?? false))
        .catch(done);
    }),
  );
  passport.serializeUser((user, done) => done(null, user.id));
  // false for a deactivated or deleted account: passport then drops the login from the session
  passport.deserializeUser((id: number, done) => {
    activeUser(deps, id)
      .then((user) => done(null, user ?? false))
      .catch(done);
  });
  return passport;
}
