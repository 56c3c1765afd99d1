import { describeInvitation } from "@/lib/server/labs/invitations";
import { json } from "@/lib/server/web/http";
import { publicRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** What the invitation link offers (lab, role, whether the address has an account). */
export const GET = publicRoute<{ token: string }>(async (_request, p) => json(await describeInvitation(p.token)));
