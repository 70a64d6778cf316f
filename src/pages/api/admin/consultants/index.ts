import { endpoint, json, parseJsonBody } from '../../../../lib/http';
import { requirePermission } from '../../../../lib/guards';
import { inviteConsultant, listConsultants } from '../../../../lib/admin/consultants';
import { inviteConsultantRequestSchema } from '../../../../schemas/admin';

export const prerender = false;

/** GET /api/admin/consultants: every consultant with their status, regions, cap and open work. */
export const GET = endpoint(async ({ locals }) => {
  requirePermission(locals, 'consultant', 'list');
  return json({ consultants: await listConsultants() });
});

/** POST /api/admin/consultants: invite a consultant by e-mail (the link lets them choose a password). */
export const POST = endpoint(async ({ locals, request }) => {
  const admin = requirePermission(locals, 'consultant', 'manage');
  const body = await parseJsonBody(request, inviteConsultantRequestSchema);
  return json({ consultant: await inviteConsultant(admin, body) }, 201);
});
