import { specimenUpdateSchema } from "@/lib/contracts/study";
import { deleteSpecimen, getSpecimen, updateSpecimen } from "@/lib/server/studies/specimens";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; specimenId: string };

export const GET = labReadRoute<P>("lab.read", async (ctx, _request, p) => json(await getSpecimen(ctx, p.specimenId)));

export const PATCH = labRoute<P>("specimen.edit", async (ctx, request, p) =>
  json(await updateSpecimen(ctx, p.specimenId, await readJson(request, specimenUpdateSchema))),
);

export const DELETE = labRoute<P>("specimen.delete", async (ctx, _request, p) => {
  await deleteSpecimen(ctx, p.specimenId);
  return new Response(null, { status: 204 });
});
