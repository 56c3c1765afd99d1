import { studyCreateSchema } from "@/lib/contracts/study";
import { createStudy, listStudies, STUDY_SORTS } from "@/lib/server/studies/studies";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";
import { parseListQuery } from "@/lib/server/web/list";

export const runtime = "nodejs";

export const GET = labReadRoute("lab.read", async (ctx, request) =>
  json(await listStudies(ctx, parseListQuery(request.url, STUDY_SORTS, "updatedAt", "desc"))),
);

export const POST = labRoute("study.create", async (ctx, request) =>
  json(await createStudy(ctx, await readJson(request, studyCreateSchema)), 201),
);
