/**
 * What `npm test` started for the tests: the app, its database, the fakes. Tests that need
 * them read these; run outside `npm test` they fail with a sentence saying so.
 */
function required(name: string): string {
  const value = process.env[name];
  if (!value) throw new Error(`${name} is not set: run these tests through \`npm test\`, which starts the stack.`);
  return value;
}

export const stack = {
  get appUrl() {
    return required('LAGWISE_APP_URL');
  },
  get databaseUrl() {
    return required('DATABASE_URL');
  },
  get mailFakeUrl() {
    return required('LAGWISE_MAIL_FAKE_URL');
  },
  get chromium() {
    return required('LAGWISE_CHROMIUM');
  },
  get pdftotext() {
    return required('LAGWISE_PDFTOTEXT');
  },
  get stateDir() {
    return required('LAGWISE_TEST_STATE_DIR');
  },
};

/** Node's fetch sends no Origin; better-auth and Astro's origin check want one on writes. */
export function appFetch(path: string, init: RequestInit = {}): Promise<Response> {
  const headers = new Headers(init.headers);
  if (!headers.has('origin')) headers.set('origin', stack.appUrl);
  return fetch(new URL(path, stack.appUrl), { ...init, headers, redirect: init.redirect ?? 'manual' });
}
