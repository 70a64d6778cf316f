import { backTo, readFormOrJson } from '../../../lib/form-posts';
import { DomainError } from '../../../lib/errors';
import { endpoint, json } from '../../../lib/http';
import { requestPasswordReset } from '../../../lib/password-reset';
import { forgotPasswordRequestSchema } from '../../../schemas/admin';

export const prerender = false;

/** POST /api/password/forgot `{ email }`: mails a link to choose a new password; the same answer for any address. */
export const POST = endpoint(async ({ request, clientAddress }) => {
  const read = await readFormOrJson(request, forgotPasswordRequestSchema);
  if (read.kind === 'form-invalid') return backTo('/forgot-password', { error: 'email' });
  try {
    await requestPasswordReset(read.body.email, clientAddress);
  } catch (error) {
    if (read.kind === 'form' && error instanceof DomainError && error.code === 'RATE_LIMITED') return backTo('/forgot-password', { error: 'limited' });
    throw error;
  }
  return read.kind === 'form' ? backTo('/forgot-password', { sent: '1' }) : json({ sent: true });
});
