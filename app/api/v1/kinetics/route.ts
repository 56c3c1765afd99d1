import { listCatalogue } from "@/lib/server/kinetics/catalogue";
import { json } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** The published catalogue: the same for every signed-in user. */
export const GET = userRoute(async () => json({ items: listCatalogue() }));
