import { getCatalogueEntry } from "@/lib/server/kinetics/catalogue";
import { json } from "@/lib/server/web/http";
import { userRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

export const GET = userRoute<{ kineticsId: string }>(async (_actor, _request, p) =>
  json(getCatalogueEntry(p.kineticsId)),
);
