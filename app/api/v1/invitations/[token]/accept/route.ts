import { acceptInvitationSchema } from "@/lib/contracts/account";
import { acceptInvitation } from "@/lib/server/data/invitations";
import { json, readJson } from "@/lib/server/http";
import { publicRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

export const POST = publicRoute<{ token: string }>(async (request, p) => json(await acceptInvitation(p.token, await readJson(request, acceptInvitationSchema))));
