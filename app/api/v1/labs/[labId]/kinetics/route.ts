import { labKineticsCreateSchema } from "@/lib/contracts/kinetics";
import { createLabKinetics, LAB_KINETICS_SORTS, listLabKinetics } from "@/lib/server/kinetics/kinetics";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

export const GET = labReadRoute("lab.read", async (ctx, request) =>
  json(await listLabKinetics(ctx, parseListQuery(request.url, LAB_KINETICS_SORTS, "updatedAt", "desc"))),
);

/** Creates the kinetics with its version 1 (modellers and lab managers). */
export const POST = labRoute("kinetics.edit", async (ctx, request) =>
  json(await createLabKinetics(ctx, await readJson(request, labKineticsCreateSchema)), 201),
);
