import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { DataSource } from 'typeorm';
import { authenticate } from './accounts.js';
import { User } from './user.entity.js';

/**
 * A passport instance of the app's own (not the global one, so several apps can live in one
 * test process): local e-mail + password, the session keeps only the user id, and a deactivated
 * user's session stops working at the next request.
 */
export function createPassport(ds: DataSource): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      authenticate(ds, email, password).then(
        (user) => done(null, user ?? false),
        (err) => done(err),
      );
    }),
  );
  passport.serializeUser<number>((user, done) => done(null, (user as User).id));
  passport.deserializeUser<number>((id, done) => {
    ds.getRepository(User)
      .findOneBy({ id })
      .then((user) => done(null, user?.active ? user : false))
      .catch((err) => done(err));
  });
  return passport;
}
