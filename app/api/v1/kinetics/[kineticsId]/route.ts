import { getCatalogueEntry } from "@/lib/server/data/kinetics";
import { json } from "@/lib/server/http";
import { userRoute } from "@/lib/server/lab-route";

export const runtime = "nodejs";

export const GET = userRoute<{ kineticsId: string }>(async (_actor, _request, p) =>
  json(getCatalogueEntry(p.kineticsId)),
);
