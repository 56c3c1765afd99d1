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
type Resolver = (m: Models, labId: string, id: string) => Promise<Found | null>;

async function uploadTarget(m: Models, labId: string, id: string): Promise<Found | null> {
  const u = await m.Upload.findOne({
    where: { id, labId },
    include: [{ model: m.Specimen, as: "specimen", attributes: ["label"] }],
  });
  if (!u) return null;
  const specimen = (u as unknown as { specimen?: { label: string } }).specimen;
  return {
    label: `the file “${u.filename}”${specimen ? ` of specimen ${specimen.label}` : ""}`,
    path: `/labs/${labId}/specimens/${u.specimenId}?discuss=${id}#discussion`,
  };
}

async function readoutTarget(m: Models, labId: string, id: string): Promise<Found | null> {
  const r = await m.Readout.findOne({
    where: { id, labId },
    include: [{ model: m.Upload, as: "upload", attributes: ["filename"] }],
  });
  if (!r) return null;
  const upload = (r as unknown as { upload?: { filename: string } }).upload;
  return { label: `the readout of “${upload?.filename ?? "a deleted file"}”`, path: `/labs/${labId}/readouts/${id}` };
}

/**
 * Fits are built later. Until models/index.ts registers a `Fit` model (table `fits`, with `labId`
 * and ideally `name`), every fit answers "fit not found"; once it is there this resolver finds it.
 */
async function fitTarget(m: Models, labId: string, id: string): Promise<Found | null> {
  const Fit = (m as unknown as Partial<Record<string, ModelStatic<Model>>>)["Fit"];
  if (!Fit) return null;
  const f = await Fit.findOne({ where: { id, labId } });
  if (!f) return null;
  const name = f.get("name");
  return { label: typeof name === "string" && name ? `the fit “${name}”` : "a fit", path: `/labs/${labId}/fits/${id}` };
}

const RESOLVERS: Record<DiscussionTargetType, Resolver> = {
  upload: uploadTarget,
  readout: readoutTarget,
  fit: fitTarget,
};

/** The target in this lab, or a 404 that names its kind ("readout not found"). */
export async function requireTarget(
  m: Models,
  labId: string,
  type: DiscussionTargetType,
  id: string,
): Promise<DiscussionTarget> {
  const found = await RESOLVERS[type](m, labId, id);
  if (!found) throw notFound(type);
  return { type, id, ...found };
}

/** The target for display; one that was deleted since is named but has no page. */
export async function describeTarget(m: Models, labId: string, type: string, id: string): Promise<DiscussionTarget> {
  const resolver = RESOLVERS[type as DiscussionTargetType];
  const found = resolver ? await resolver(m, labId, id) : null;
  return {
    type: type as DiscussionTargetType,
    id,
    label: found?.label ?? `a deleted ${type}`,
    path: found?.path ?? null,
  };
}
