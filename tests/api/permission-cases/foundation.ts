/** Foundation routes: accounts, labs, members, invitations, audit, studies, specimens, uploads, tokens, jobs. */
import { createToken } from "@/lib/server/accounts/tokens";
import { database } from "@/lib/server/services";
import { enqueueJob } from "@/lib/server/jobs/queue";
import { multipart } from "../../support/api";
import { makePerson } from "../../support/world";
import {
  ALL,
  MANAGER_ONLY,
  NOT_COLLAB,
  PUBLIC,
  USER,
  invitation,
  lab,
  next,
  png,
  specimen,
  study,
  upload,
  type Case,
} from "./shared";

export const cases: Record<string, Case> = {
  "POST /api/v1/signup": {
    setup: async () => ({
      json: { name: "N", email: `new${next()}@lab.test`, password: "long-enough-pw", labName: "New Lab" },
    }),
    expect: PUBLIC(202),
  },
  "GET /api/v1/me": { setup: async () => ({}), expect: USER(200) },
  "PATCH /api/v1/me": { setup: async () => ({ json: { notifyByEmail: false } }), expect: USER(200) },
  "GET /api/v1/labs": { setup: async () => ({}), expect: USER(200) },
  "POST /api/v1/labs": { setup: async () => ({ json: { name: `Lab ${next()}` } }), expect: USER(201) },
  "GET /api/v1/tokens": { setup: async () => ({}), expect: USER(200) },
  "POST /api/v1/tokens": { setup: async () => ({ json: { name: "script" } }), expect: USER(201) },
  "DELETE /api/v1/tokens/[tokenId]": {
    // Always the manager's token: only the manager may revoke it; for anyone else it does not exist.
    setup: async (w) => {
      return { params: { tokenId: (await createToken(w.people.manager.actor, "victim")).id } };
    },
    expect: { manager: 204, scientist: 404, modeller: 404, collaborator: 404, outsider: 404, anonymous: 401 },
  },
  "GET /api/v1/invitations/[token]": {
    setup: async (w) => ({ params: { token: (await invitation(w)).token } }),
    expect: PUBLIC(200),
  },
  // Bound to the invitee (issue 10, item 14): anyone signed in as another account is refused.
  "POST /api/v1/invitations/[token]/accept": {
    setup: async (w) => ({
      params: { token: (await invitation(w)).token },
      json: { name: "Invitee", password: "long-enough-pw" },
    }),
    expect: { ...PUBLIC(403), anonymous: 200 },
  },
  "GET /api/v1/labs/[labId]": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "GET /api/v1/labs/[labId]/members": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "PATCH /api/v1/labs/[labId]/members/[memberId]": {
    setup: async (w) => {
      const p = await makePerson("scientist", w.labId, "extra");
      const m = await database();
      const ms = await m.Membership.findOne({ where: { labId: w.labId, userId: p.userId } });
      return { params: lab(w, { memberId: ms!.id }), json: { role: "modeller" } };
    },
    expect: MANAGER_ONLY(200),
  },
  "DELETE /api/v1/labs/[labId]/members/[memberId]": {
    setup: async (w) => {
      const p = await makePerson("scientist", w.labId, "extra");
      const m = await database();
      const ms = await m.Membership.findOne({ where: { labId: w.labId, userId: p.userId } });
      return { params: lab(w, { memberId: ms!.id }) };
    },
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/invitations": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "POST /api/v1/labs/[labId]/invitations": {
    setup: async (w) => ({ params: lab(w), json: { email: `fresh${next()}@lab.test`, role: "collaborator" } }),
    expect: MANAGER_ONLY(201),
  },
  "DELETE /api/v1/labs/[labId]/invitations/[invitationId]": {
    setup: async (w) => ({ params: lab(w, { invitationId: (await invitation(w)).inv.id }) }),
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/audit": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "GET /api/v1/labs/[labId]/mailbox": { setup: async (w) => ({ params: lab(w) }), expect: MANAGER_ONLY(200) },
  "GET /api/v1/labs/[labId]/studies": {
    setup: async (w) => ({ params: lab(w), query: "sort=name&dir=asc" }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/studies": {
    setup: async (w) => ({ params: lab(w), json: { name: "Mine", tissue: "skin", organism: "chick" } }),
    expect: NOT_COLLAB(201),
  },
  "GET /api/v1/labs/[labId]/studies/[studyId]": {
    setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }),
    expect: ALL(200),
  },
  "PATCH /api/v1/labs/[labId]/studies/[studyId]": {
    setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }), json: { name: "Renamed" } }),
    expect: MANAGER_ONLY(200),
  },
  "DELETE /api/v1/labs/[labId]/studies/[studyId]": {
    setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }),
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/studies/[studyId]/conditions": {
    setup: async (w) => ({ params: lab(w, { studyId: (await specimen(w)).studyId }) }),
    expect: ALL(200),
  },
  // Renaming a condition edits the study (the manager's here): as PATCH of the study itself.
  "PATCH /api/v1/labs/[labId]/studies/[studyId]/conditions": {
    setup: async (w) => ({
      params: lab(w, { studyId: (await specimen(w)).studyId }),
      json: { from: "Control", to: "wild type" },
    }),
    expect: MANAGER_ONLY(200),
  },
  "GET /api/v1/labs/[labId]/studies/[studyId]/specimens": {
    setup: async (w) => ({ params: lab(w, { studyId: (await study(w)).id }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/studies/[studyId]/specimens": {
    setup: async (w) => ({
      params: lab(w, { studyId: (await study(w)).id }),
      json: { label: "A1", condition: "control" },
    }),
    expect: NOT_COLLAB(201),
  },
  "GET /api/v1/labs/[labId]/specimens/[specimenId]": {
    setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }),
    expect: ALL(200),
  },
  "PATCH /api/v1/labs/[labId]/specimens/[specimenId]": {
    setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }), json: { stage: "E12" } }),
    expect: MANAGER_ONLY(200),
  },
  "DELETE /api/v1/labs/[labId]/specimens/[specimenId]": {
    setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }),
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/specimens/[specimenId]/uploads": {
    setup: async (w) => ({ params: lab(w, { specimenId: (await specimen(w)).id }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads": {
    setup: async (w) => ({
      params: lab(w, { specimenId: (await specimen(w)).id }),
      form: multipart({ name: "p.png", bytes: await png() }, { pixelSizeUm: "0.65" }),
    }),
    expect: NOT_COLLAB(201),
  },
  "GET /api/v1/labs/[labId]/uploads/[uploadId]": {
    setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }),
    expect: ALL(200),
  },
  "DELETE /api/v1/labs/[labId]/uploads/[uploadId]": {
    setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }),
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/uploads/[uploadId]/content": {
    setup: async (w) => ({ params: lab(w, { uploadId: (await upload(w)).id }) }),
    expect: ALL(200),
  },
  "GET /api/v1/labs/[labId]/jobs": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "GET /api/v1/labs/[labId]/jobs/[jobId]": {
    setup: async (w) => ({
      params: lab(w, {
        jobId: (
          await enqueueJob({ labId: w.labId, kind: "echo", payload: { ms: 0 }, requestedBy: w.people.manager.userId })
        ).id,
      }),
    }),
    expect: ALL(200),
  },
  "DELETE /api/v1/labs/[labId]/jobs/[jobId]": {
    // The manager's own long job: only the manager may cancel it.
    setup: async (w) => ({
      params: lab(w, {
        jobId: (
          await enqueueJob({
            labId: w.labId,
            kind: "echo",
            payload: { ms: 5000 },
            requestedBy: w.people.manager.userId,
          })
        ).id,
      }),
    }),
    expect: MANAGER_ONLY(200),
  },
};
