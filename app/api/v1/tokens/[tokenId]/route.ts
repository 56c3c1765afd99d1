import { revokeToken } from "@/lib/server/accounts/tokens";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const DELETE = userRoute<{ tokenId: string }>(async (actor, _request, p) => {
  await revokeToken(actor, p.tokenId);
  return new Response(null, { status: 204 });
});
