/** Where this deployment is reached from the outside; links in e-mail are built on it. */
export function appBaseUrl(): string {
  return (process.env.PUBLIC_BASE_URL ?? process.env.BETTER_AUTH_URL ?? 'http://127.0.0.1:4321').replace(/\/+$/, '');
}

/** Origins allowed to post to auth routes: the public URL plus both loopback spellings of it. */
export function trustedOrigins(): string[] {
  const base = new URL(appBaseUrl());
  const origins = new Set([base.origin]);
  if (base.hostname === '127.0.0.1' || base.hostname === 'localhost') {
    origins.add(`${base.protocol}//127.0.0.1:${base.port}`);
    origins.add(`${base.protocol}//localhost:${base.port}`);
  }
  for (const extra of (process.env.LAGWISE_TRUSTED_ORIGINS ?? '').split(',')) {
    if (extra.trim()) origins.add(extra.trim());
  }
  return [...origins];
}

import packageJson from '../../package.json';

/** The version of this build, from package.json. */
export const APP_VERSION: string = packageJson.version;
