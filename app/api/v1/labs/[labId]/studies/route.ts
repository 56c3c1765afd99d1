import { studyCreateSchema } from "@/lib/contracts/study";
import { createStudy, listStudies, STUDY_SORTS } from "@/lib/server/data/studies";
import { json, readJson } from "@/lib/server/http";
import { labRoute } from "@/lib/server/lab-route";
import { parseListQuery } from "@/lib/server/list";

export const runtime = "nodejs";

export const GET = labRoute("lab.read", async (ctx, request) =>
  json(await listStudies(ctx, parseListQuery(request.url, STUDY_SORTS, "updatedAt", "desc"))),
);

export const POST = labRoute("study.create", async (ctx, request) =>
  json(await createStudy(ctx, await readJson(request, studyCreateSchema)), 201),
);
