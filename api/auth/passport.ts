/**
 * Passport with Google's OAuth 2.0 strategy. In demo and test mode its URLs point at the
 * local stand-in; in production at Google (config.ts). One Passport instance per app.
 * Only invited, active people get a session; the OAuth `state` (with PKCE) is kept in the
 * session and checked on the callback.
 *
 * The account is pinned to its Google identity: the profile's e-mail must be verified, the
 * Google subject (`sub`) is stored at the first sign-in and any other subject asserting the
 * same address is refused (an admin can reset it); with GOOGLE_HOSTED_DOMAIN set, the
 * userinfo `hd` claim must name that domain; an invitation past its expiry cannot be used.
 */
import { Passport } from 'passport';
import { Strategy as GoogleStrategy, type Profile } from 'passport-google-oauth20';
import * as audit from '../audit/service';
import type { AppContext } from '../context';
import type { Caller } from '../http/routes';
import * as people from '../people/service';
import { sessionPerson } from '../people/session-person';

export type SignInRefusal =
  | 'not_invited'
  | 'deactivated'
  | 'no_email'
  | 'email_unverified'
  | 'wrong_domain'
  | 'identity_mismatch'
  | 'invitation_expired';

/** Google's userinfo claims beyond what passport maps onto the profile. */
interface UserinfoJson {
  email_verified?: boolean | string;
  hd?: string;
}

export function createPassport({ db, config }: AppContext): InstanceType<typeof Passport> {
  const passport = new Passport();
  passport.use(
    new GoogleStrategy(
      {
        clientID: config.oauth.clientId,
        clientSecret: config.oauth.clientSecret,
        callbackURL: config.oauth.callbackURL,
        authorizationURL: config.oauth.authorizationURL,
        tokenURL: config.oauth.tokenURL,
        userProfileURL: config.oauth.userProfileURL,
        scope: ['openid', 'email', 'profile'],
        state: true,
        pkce: true,
      },
      async (
        _accessToken: string,
        _refreshToken: string,
        profile: Profile,
        done: (err: unknown, user?: Caller | false, info?: { reason: SignInRefusal; email?: string }) => void,
      ) => {
        try {
          const email = profile.emails?.[0]?.value;
          if (!email) return done(null, false, { reason: 'no_email' });
          const json = ((profile as { _json?: UserinfoJson })._json ?? {}) as UserinfoJson;
          // Google sends a boolean; older endpoints sent the string "true".
          const verified = json.email_verified === true || json.email_verified === 'true';
          if (!verified) return done(null, false, { reason: 'email_unverified', email });
          if (config.googleHostedDomain && (json.hd ?? '').toLowerCase() !== config.googleHostedDomain) {
            return done(null, false, { reason: 'wrong_domain', email });
          }
          const user = await people.findPersonByEmail(db, email);
          if (!user) return done(null, false, { reason: 'not_invited', email });
          if (!user.active) return done(null, false, { reason: 'deactivated', email });
          const holder = await people.findPersonByGoogleSub(db, profile.id);
          if ((user.googleSub !== null && user.googleSub !== profile.id) || (holder && holder.id !== user.id)) {
            await audit.record(db, {
              actorId: null,
              actorEmail: email,
              action: 'sign_in.refused',
              targetType: 'user',
              targetId: user.id,
              after: { reason: 'identity_mismatch' },
            });
            return done(null, false, { reason: 'identity_mismatch', email });
          }
          if (people.invitationExpired(user)) {
            await audit.record(db, {
              actorId: null,
              actorEmail: email,
              action: 'sign_in.refused',
              targetType: 'user',
              targetId: user.id,
              after: { reason: 'invitation_expired' },
            });
            return done(null, false, { reason: 'invitation_expired', email });
          }
          await db.transaction(async (trx) => {
            await people.recordSignIn(trx, user.id, profile.id, profile.displayName ?? '');
            await audit.record(trx, {
              actorId: user.id,
              actorEmail: user.email,
              action: 'sign_in',
              targetType: 'user',
              targetId: user.id,
            });
          });
          done(null, { id: user.id, email: user.email, name: user.name, role: user.role, active: user.active });
        } catch (err) {
          done(err);
        }
      },
    ),
  );
  passport.serializeUser((user, done) => done(null, (user as Caller).id));
  passport.deserializeUser(async (id: number, done) => {
    try {
      done(null, (await sessionPerson(db, Number(id))) ?? false);
    } catch (err) {
      done(err);
    }
  });
  return passport;
}
