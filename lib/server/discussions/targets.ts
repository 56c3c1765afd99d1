/**
 * What a discussion can be about, and how to find it in a lab. A target that is not in the
 * caller's lab does not exist for them (404). Adding a kind: one word in DISCUSSION_TARGET_TYPES
 * (lib/contracts/discussion.ts) and one resolver line here.
 */
import "server-only";
import type { Model, ModelStatic } from "sequelize";
import type { DiscussionTarget, DiscussionTargetType } from "@/lib/contracts/discussion";
import type { Models } from "@/models";
import { notFound } from "../errors";

type Found = Pick<DiscussionTarget, "label" | "path">;
/** Finds many targets of one kind in one query; ids not in the lab are absent from the map. */
type Resolver = (m: Models, labId: string, ids: string[]) => Promise<Map<string, Found>>;

const uploadTargets: Resolver = async (m, labId, ids) => {
  const rows = await m.Upload.findAll({
    where: { id: ids, labId },
    include: [{ model: m.Specimen, as: "specimen", attributes: ["label"] }],
  });
  return new Map(
    rows.map((u) => {
      const specimen = (u as unknown as { specimen?: { label: string } }).specimen;
      return [
        u.id,
        {
          label: `the file “${u.filename}”${specimen ? ` of specimen ${specimen.label}` : ""}`,
          path: `/labs/${labId}/specimens/${u.specimenId}?discuss=${u.id}#discussion`,
        },
      ];
    }),
  );
};

const readoutTargets: Resolver = async (m, labId, ids) => {
  const rows = await m.Readout.findAll({
    where: { id: ids, labId },
    include: [{ model: m.Upload, as: "upload", attributes: ["filename"] }],
  });
  return new Map(
    rows.map((r) => {
      const upload = (r as unknown as { upload?: { filename: string } }).upload;
      return [
        r.id,
        { label: `the readout of “${upload?.filename ?? "a deleted file"}”`, path: `/labs/${labId}/readouts/${r.id}` },
      ];
    }),
  );
};

/**
 * Fits are built later. Until models/index.ts registers a `Fit` model (table `fits`, with `labId`
 * and ideally `name`), every fit answers "fit not found"; once it is there this resolver finds it.
 */
const fitTargets: Resolver = async (m, labId, ids) => {
  const Fit = (m as unknown as Partial<Record<string, ModelStatic<Model>>>)["Fit"];
  if (!Fit) return new Map();
  const rows = await Fit.findAll({ where: { id: ids, labId } });
  return new Map(
    rows.map((f) => {
      const name = f.get("name");
      const id = String(f.get("id"));
      return [
        id,
        { label: typeof name === "string" && name ? `the fit “${name}”` : "a fit", path: `/labs/${labId}/fits/${id}` },
      ];
    }),
  );
};

const RESOLVERS: Record<DiscussionTargetType, Resolver> = {
  upload: uploadTargets,
  readout: readoutTargets,
  fit: fitTargets,
};

/** The target in this lab, or a 404 that names its kind ("readout not found"). */
export async function requireTarget(
  m: Models,
  labId: string,
  type: DiscussionTargetType,
  id: string,
): Promise<DiscussionTarget> {
  const found = (await RESOLVERS[type](m, labId, [id])).get(id);
  if (!found) throw notFound(type);
  return { type, id, ...found };
}

/** The target for display; one that was deleted since is named but has no page. */
export async function describeTarget(m: Models, labId: string, type: string, id: string): Promise<DiscussionTarget> {
  return (await describeTargets(m, labId, [{ type, id }])).get(`${type}:${id}`)!;
}

/**
 * Many targets for display, keyed "type:id": one query per kind of target, whatever their number
 * (a lab's list of open discussions names the object of every thread).
 */
export async function describeTargets(
  m: Models,
  labId: string,
  refs: { type: string; id: string }[],
): Promise<Map<string, DiscussionTarget>> {
  const idsByType = new Map<string, Set<string>>();
  for (const r of refs) idsByType.set(r.type, (idsByType.get(r.type) ?? new Set()).add(r.id));
  const found = new Map<string, Found>();
  await Promise.all(
    [...idsByType].map(async ([type, ids]) => {
      const resolver = RESOLVERS[type as DiscussionTargetType];
      if (!resolver) return;
      for (const [id, f] of await resolver(m, labId, [...ids])) found.set(`${type}:${id}`, f);
    }),
  );
  const out = new Map<string, DiscussionTarget>();
  for (const { type, id } of refs) {
    const f = found.get(`${type}:${id}`);
    out.set(`${type}:${id}`, {
      type: type as DiscussionTargetType,
      id,
      label: f?.label ?? `a deleted ${type}`,
      path: f?.path ?? null,
    });
  }
  return out;
}
