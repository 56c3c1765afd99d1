import { listCatalogue } from "@/lib/server/data/kinetics";
import { json } from "@/lib/server/http";
import { userRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

/** The published catalogue: the same for every signed-in user. */
export const GET = userRoute(async () => json({ items: listCatalogue() }));
