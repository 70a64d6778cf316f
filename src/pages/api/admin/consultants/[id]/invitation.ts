import { endpoint, json } from '../../../../../lib/http';
import { requirePermission } from '../../../../../lib/guards';
import { resendInvitation, withdrawInvitation } from '../../../../../lib/admin/consultants';

export const prerender = false;

/** POST /api/admin/consultants/{id}/invitation: send the invitation again with a new link (the old one stops working). */
export const POST = endpoint(async ({ locals, params }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  return json({ consultant: await resendInvitation(admin, params.id) });
});

/** DELETE /api/admin/consultants/{id}/invitation: withdraw it; the unused account goes too. */
export const DELETE = endpoint(async ({ locals, params }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  await withdrawInvitation(admin, params.id);
  return new Response(null, { status: 204 });
});
