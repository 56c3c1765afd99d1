import { invitationCreateSchema } from "@/lib/contracts/lab";
import { createInvitation, listInvitations } from "@/lib/server/labs/invitations";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";
import { addressOf } from "@/lib/server/web/rate-limit";

export const runtime = "nodejs";

export const GET = labRoute("invitation.manage", async (ctx) => json({ items: await listInvitations(ctx) }));

export const POST = labRoute("invitation.manage", async (ctx, request) => {
  const { email, role } = await readJson(request, invitationCreateSchema);
  return json(await createInvitation(ctx, email, role, addressOf(request)), 201);
});
