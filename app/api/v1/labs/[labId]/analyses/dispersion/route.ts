import { dispersionRequestSchema } from "@/lib/contracts/kinetics";
import { analyseDispersion } from "@/lib/server/kinetics/analyses";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Computed on request for a catalogue kinetics or a lab kinetics at a version; nothing is stored. */
export const POST = labRoute("lab.read", async (ctx, request) =>
  json(await analyseDispersion(ctx, await readJson(request, dispersionRequestSchema))),
);
