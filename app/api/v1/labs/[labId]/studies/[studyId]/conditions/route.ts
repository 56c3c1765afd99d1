import { conditionRenameSchema } from "@/lib/contracts/study";
import { listStudyConditions, renameStudyCondition } from "@/lib/server/studies/conditions";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; studyId: string };

export const GET = labReadRoute<P>("lab.read", async (ctx, _request, p) =>
  json({ items: await listStudyConditions(ctx, p.studyId) }),
);

export const PATCH = labRoute<P>("study.edit", async (ctx, request, p) =>
  json(await renameStudyCondition(ctx, p.studyId, await readJson(request, conditionRenameSchema))),
);
