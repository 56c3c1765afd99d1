import { acceptInvitationSchema } from "@/lib/contracts/account";
import { getActor } from "@/lib/server/accounts/actor";
import { acceptInvitation } from "@/lib/server/labs/invitations";
import { json, readJson } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Public (the link is the credential), but bound to the invitee: another account's session is refused. */
export const POST = publicRoute<{ token: string }>(async (request, p) => {
  const input = await readJson(request, acceptInvitationSchema);
  return json(await acceptInvitation(p.token, input, await getActor(request)));
});
