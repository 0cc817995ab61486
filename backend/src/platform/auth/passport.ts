import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { AuthService } from '../../components/auth/domain/auth-service';

interface SessionRef {
  userId: number;
  organisationId: number;
}

/**
 * One Passport per app instance (the default export is a process-wide singleton, which piles up
 * (de)serialisers when tests build several apps). The session keeps only ids; the principal is
 * reloaded from the database on each request.
 */
export function createPassport(auth: AuthService): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      auth.checkCredentials(email, password).then((p) => done(null, p ?? false), done);
    }),
  );
  passport.serializeUser<SessionRef>((user, done) =>
    done(null, { userId: user.userId, organisationId: user.organisationId }),
  );
  passport.deserializeUser<SessionRef>((ref, done) => {
    auth.principal(ref.userId, ref.organisationId).then((p) => done(null, p ?? false), done);
  });
  return passport;
}
