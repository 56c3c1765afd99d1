import { revokeInvitation } from "@/lib/server/labs/invitations";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const DELETE = labRoute<{ labId: string; invitationId: string }>(
  "invitation.manage",
  async (ctx, _request, p) => {
    await revokeInvitation(ctx, p.invitationId);
    return new Response(null, { status: 204 });
  },
);
