// passport-local with e-mail and password. The session keeps a small snapshot of the person
// ({ id, email, name, role }) so a signed-in request needs no extra user query; role changes and
// deactivation end the person's sessions instead (services/people.ts `endSessionsOf`).
import passport, { type PassportStatic } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { SessionUser } from '../../shared/schemas/session';
import type { Db } from '../db';
import { findPersonByEmail, toSessionUser } from '../services/people';
import { verifyPassword } from './passwords';

export function createPassport(db: Db): PassportStatic {
  const instance = new passport.Passport() as unknown as PassportStatic;
  instance.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password' }, (email, password, done) => {
      findPersonByEmail(db, email)
        .then(async (person) => {
          // Always run one bcrypt comparison, so timing does not reveal whether the e-mail exists.
          const ok = await verifyPassword(password, person?.active ? person.password_hash : null);
          done(null, ok && person ? toSessionUser(person) : false);
        })
        .catch((error: unknown) => done(error));
    }),
  );
  instance.serializeUser((user, done) => done(null, toSessionUser(user as SessionUser)));
  instance.deserializeUser((snapshot: SessionUser, done) => done(null, snapshot));
  return instance;
}
