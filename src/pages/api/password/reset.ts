import { backTo, readFormOrJson } from '../../../lib/form-posts';
import { DomainError } from '../../../lib/errors';
import { endpoint, json } from '../../../lib/http';
import { resetPassword } from '../../../lib/password-reset';
import { resetPasswordRequestSchema } from '../../../schemas/admin';

export const prerender = false;

/** POST /api/password/reset `{ token, password }`: sets the new password from an e-mailed link and ends every session. */
export const POST = endpoint(async ({ request }) => {
  const read = await readFormOrJson(request, resetPasswordRequestSchema);
  if (read.kind === 'form-invalid') {
    return backTo('/set-password', { token: read.fields.token, error: read.firstPath === 'password' ? 'password' : 'link' });
  }
  try {
    await resetPassword(read.body.token, read.body.password);
  } catch (error) {
    if (read.kind === 'form' && error instanceof DomainError) return backTo('/set-password', { error: 'gone' });
    throw error;
  }
  return read.kind === 'form' ? backTo('/sign-in', { reset: '1' }) : json({ reset: true });
});
