import { studyUpdateSchema } from "@/lib/contracts/study";
import { deleteStudy, getStudy, updateStudy } from "@/lib/server/studies/studies";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; studyId: string };

export const GET = labReadRoute<P>("lab.read", async (ctx, _request, p) => json(await getStudy(ctx, p.studyId)));

export const PATCH = labRoute<P>("study.edit", async (ctx, request, p) =>
  json(await updateStudy(ctx, p.studyId, await readJson(request, studyUpdateSchema))),
);

export const DELETE = labRoute<P>("study.delete", async (ctx, _request, p) => {
  await deleteStudy(ctx, p.studyId);
  return new Response(null, { status: 204 });
});
