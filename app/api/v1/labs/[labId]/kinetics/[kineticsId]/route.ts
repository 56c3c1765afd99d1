import { z } from "zod";
import { labKineticsUpdateSchema } from "@/lib/contracts/kinetics";
import {
  deleteLabKinetics,
  getLabKinetics,
  getLabKineticsVersion,
  updateLabKinetics,
} from "@/lib/server/kinetics/kinetics";
import { definitionInfo } from "@/lib/server/kinetics/catalogue";
import { AppError } from "@/lib/server/errors";
import { json, readJson } from "@/lib/server/web/http";
import { labReadRoute, labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

type P = { labId: string; kineticsId: string };

const versionQuery = z.coerce.number().int().min(1).optional();

/** The kinetics and the definition of one version (`?version=N`, default the latest). */
export const GET = labReadRoute<P>("lab.read", async (ctx, request, p) => {
  const raw = new URL(request.url).searchParams.get("version");
  const parsed = versionQuery.safeParse(raw ?? undefined);
  if (!parsed.success) throw new AppError("bad_input", "version: must be a whole number from 1");
  const kinetics = await getLabKinetics(ctx, p.kineticsId);
  const v = await getLabKineticsVersion(ctx, p.kineticsId, parsed.data);
  return json({
    kinetics,
    version: v.version,
    definition: v.definition,
    info: definitionInfo(p.kineticsId, v.version, v.definition),
  });
});

/** Saves a new version (its creator or a lab manager); earlier versions are kept unchanged. */
export const PATCH = labRoute<P>("kinetics.edit", async (ctx, request, p) =>
  json(await updateLabKinetics(ctx, p.kineticsId, await readJson(request, labKineticsUpdateSchema))),
);

export const DELETE = labRoute<P>("kinetics.edit", async (ctx, _request, p) => {
  await deleteLabKinetics(ctx, p.kineticsId);
  return new Response(null, { status: 204 });
});
