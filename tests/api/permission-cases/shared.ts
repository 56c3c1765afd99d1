/**
 * Shared pieces of the permission matrix: who calls, what each role may expect, fixtures that
 * create fresh objects as the lab manager. Each area's cases live in a file beside this one and
 * export `cases: Record<"METHOD /api/v1/…", Case>`.
 */
import sharp from "sharp";
import type { Role } from "@/lib/access/roles";
import type { LabContext } from "@/lib/server/access";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import { newSecret, sha256Hex } from "@/lib/server/secrets";
import { database } from "@/lib/server/services";
import type { World } from "../../support/world";

export type Who = Role | "outsider" | "anonymous";
export type Expect = Record<Who, number>;
export interface Setup {
  params?: Record<string, string>;
  json?: unknown;
  form?: FormData;
  query?: string;
}
export interface Case {
  setup: (w: World, who: Who) => Promise<Setup>;
  expect: Expect;
}

export const ALL = (s: number, outsider = 404, anonymous = 401): Expect => ({
  manager: s,
  scientist: s,
  modeller: s,
  collaborator: s,
  outsider,
  anonymous,
});
export const MANAGER_ONLY = (s: number): Expect => ({
  manager: s,
  scientist: 403,
  modeller: 403,
  collaborator: 403,
  outsider: 404,
  anonymous: 401,
});
export const NOT_COLLAB = (s: number): Expect => ({
  manager: s,
  scientist: s,
  modeller: s,
  collaborator: 403,
  outsider: 404,
  anonymous: 401,
});
export const USER = (s: number): Expect => ({
  manager: s,
  scientist: s,
  modeller: s,
  collaborator: s,
  outsider: s,
  anonymous: 401,
});
export const PUBLIC = (s: number): Expect => ({
  manager: s,
  scientist: s,
  modeller: s,
  collaborator: s,
  outsider: s,
  anonymous: s,
});

let pngBytes: Uint8Array | null = null;
export async function png(): Promise<Uint8Array> {
  return (pngBytes ??= new Uint8Array(
    await sharp({ create: { width: 32, height: 32, channels: 3, background: { r: 90, g: 120, b: 100 } } })
      .png()
      .toBuffer(),
  ));
}
let seq = 0;
export const next = () => ++seq;
export const managerCtx = (w: World): LabContext => ({
  actor: w.people.manager.actor,
  labId: w.labId,
  labName: "Test Lab",
  role: "manager",
});
export const study = async (w: World) =>
  createStudy(managerCtx(w), { name: `S${++seq}`, tissue: "skin", organism: "chick", description: null });
export const specimen = async (w: World) =>
  createSpecimen(managerCtx(w), (await study(w)).id, {
    label: `X${++seq}`,
    condition: "control",
    stage: null,
    genotype: null,
    notes: null,
  });
export const upload = async (w: World) => {
  const sp = await specimen(w);
  const { storeUpload } = await import("@/lib/server/uploads/uploads");
  const { writeFileSync, mkdtempSync } = await import("node:fs");
  const { tmpdir } = await import("node:os");
  const file = `${mkdtempSync(`${tmpdir()}/mk-`)}/a.png`;
  const bytes = await png();
  writeFileSync(file, bytes);
  return storeUpload(managerCtx(w), sp.id, {
    path: file,
    filename: "a.png",
    sizeBytes: bytes.length,
    sha256: sha256Hex(Buffer.from(bytes)),
    kind: "image",
    contentType: "image/png",
    pixelSizeUm: 1,
    pixelSizeSource: "uploader",
  });
};
export const invitation = async (w: World) => {
  const m = await database();
  const token = newSecret("inv");
  const inv = await m.Invitation.create({
    labId: w.labId,
    email: `inv${++seq}@lab.test`,
    role: "scientist",
    tokenHash: sha256Hex(token),
    invitedBy: w.people.manager.userId,
    expiresAt: new Date(Date.now() + 86_400_000),
  });
  return { inv, token };
};
export const lab = (w: World, extra: Record<string, string> = {}) => ({ labId: w.labId, ...extra });
