import { specimenCreateSchema } from "@/lib/contracts/study";
import { createSpecimen, listSpecimens, SPECIMEN_SORTS } from "@/lib/server/studies/specimens";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

type P = { labId: string; studyId: string };

export const GET = labReadRoute<P>("lab.read", async (ctx, request, p) =>
  json(await listSpecimens(ctx, p.studyId, parseListQuery(request.url, SPECIMEN_SORTS, "label", "asc"))),
);

export const POST = labRoute<P>("specimen.create", async (ctx, request, p) =>
  json(await createSpecimen(ctx, p.studyId, await readJson(request, specimenCreateSchema)), 201),
);
