import { memberUpdateSchema } from "@/lib/contracts/lab";
import { changeMemberRole, removeMember } from "@/lib/server/labs/members";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; memberId: string };

export const PATCH = labRoute<P>("member.manage", async (ctx, request, p) => {
  const { role } = await readJson(request, memberUpdateSchema);
  return json(await changeMemberRole(ctx, p.memberId, role));
});

export const DELETE = labRoute<P>("member.manage", async (ctx, _request, p) => {
  await removeMember(ctx, p.memberId);
  return new Response(null, { status: 204 });
});
