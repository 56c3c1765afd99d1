import { turingMapRequestSchema } from "@/lib/contracts/kinetics";
import { analyseTuringMap } from "@/lib/server/kinetics/map";
import { json, readJson } from "@/lib/server/web/http";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

/** Computed on request for a catalogue kinetics or a lab kinetics at a version; nothing is stored. */
export const POST = labRoute("lab.read", async (ctx, request) =>
  json(await analyseTuringMap(ctx, await readJson(request, turingMapRequestSchema))),
);
