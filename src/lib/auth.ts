/**
 * better-auth: consultants and admins sign in with e-mail and password, owners with an
 * e-mailed sign-in link. Roles and permissions come from ./permissions.
 */
import { betterAuth, type BetterAuthOptions } from 'better-auth';
import { drizzleAdapter } from 'better-auth/adapters/drizzle';
import { admin, magicLink } from 'better-auth/plugins';
import { getDb } from '../db/client';
import * as schema from '../db/schema';
import { accessControl, roles } from './permissions';
import { appBaseUrl, trustedOrigins } from './site';
import { deliverSignInLink } from './sign-in-links';
import { deliverPasswordReset, notePasswordReset, PASSWORD_RESET_SECONDS } from './password-reset';

/** A sign-in link is good for a day: owners open confirmation mail hours later. */
const SIGN_IN_LINK_SECONDS = 24 * 60 * 60;

/** The options, apart so better-auth's schema generator reads the same ones the server uses. */
export function authOptions() {
  const secret = process.env.BETTER_AUTH_SECRET;
  if (!secret) throw new Error('BETTER_AUTH_SECRET is not set; start the app with `npm start`, which sets it.');
  return {
    appName: 'Lagwise',
    secret,
    baseURL: appBaseUrl(),
    trustedOrigins: trustedOrigins(),
    database: drizzleAdapter(getDb(), { provider: 'pg', schema }),
    emailAndPassword: {
      enabled: true,
      // Consultants are invited by an admin; nobody signs themselves up with a password.
      disableSignUp: true,
      minPasswordLength: 10,
      maxPasswordLength: 128,
      // A forgotten password: better-auth mints the token, our pages and the mail queue carry it.
      resetPasswordTokenExpiresIn: PASSWORD_RESET_SECONDS,
      revokeSessionsOnPasswordReset: true,
      sendResetPassword: async ({ user, token }) => deliverPasswordReset({ email: user.email, name: user.name, token }),
      onPasswordReset: async ({ user }) => notePasswordReset(user.id),
    },
    // Reset links are kept as their hash, like sign-in links, so the table gives nothing away.
    verification: { storeIdentifier: { default: 'plain', overrides: { 'reset-password:': 'hashed' } } },
    session: { expiresIn: 60 * 60 * 24 * 14, updateAge: 60 * 60 * 24 },
    advanced: {
      // Behind TLS, cookies go only over TLS (and take the __Secure- prefix).
      useSecureCookies: appBaseUrl().startsWith('https:'),
      database: { generateId: 'uuid' },
      ipAddress: { ipAddressHeaders: ['x-lagwise-client-address'] },
    },
    plugins: [
      admin({ ac: accessControl, roles, defaultRole: 'owner', adminRoles: ['admin'] }),
      magicLink({
        expiresIn: SIGN_IN_LINK_SECONDS,
        // Owner accounts are made when an assessment is submitted, never from the sign-in form.
        disableSignUp: true,
        storeToken: 'hashed',
        sendMagicLink: async ({ email, url, metadata }) => deliverSignInLink({ email, url, metadata }),
      }),
    ],
  } satisfies BetterAuthOptions;
}

function createAuth() {
  return betterAuth(authOptions());
}

export type Auth = ReturnType<typeof createAuth>;
let instance: Auth | undefined;

/** The server's auth instance, made on first use so build-time imports need no secret. */
export function getAuth(): Auth {
  instance ??= createAuth();
  return instance;
}

/** The request's headers with the client address better-auth's rate limiter keys on. */
export function headersForAuth(request: Request, clientAddress: string): Headers {
  const headers = new Headers(request.headers);
  headers.set('x-lagwise-client-address', clientAddress);
  return headers;
}
