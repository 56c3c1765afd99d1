/**
 * Lab search (GET /api/v1/labs/:labId/search): hits grouped by kind with a line of context and a
 * link, inside the caller's lab only, `%` `_` `'` taken literally, the letters A–Z matched in either
 * case and other letters as typed — the same on SQLite and PostgreSQL (this file runs on both).
 * Expected values are the product rules of the search issue ("common practice, no source").
 */
import { describe, expect, it } from "vitest";
import { ROLES } from "@/lib/access/roles";
import type { LabContext } from "@/lib/server/access";
import { loadSearchPage } from "@/lib/server/search/pages";
import { database } from "@/lib/server/services";
import { setupLabApi } from "../support/lab-api";
import {
  seedFit,
  seedReadout,
  seedRun,
  seedSpecimen,
  seedStudy,
  seedThread,
  seedUpload,
} from "../support/search-fixtures";

const lab = setupLabApi({ who: "scientist" });
const SEARCH = "/api/v1/labs/[labId]/search";

const search = (q: string, o: { who?: (typeof ROLES)[number]; limit?: number; labId?: string } = {}) =>
  lab.api("GET", SEARCH, {
    who: o.who,
    params: o.labId ? { labId: o.labId } : undefined,
    query: `q=${encodeURIComponent(q)}${o.limit ? `&limit=${o.limit}` : ""}`,
  });

type Group = { kind: string; label: string; more: boolean; items: { name: string; context: string; href: string }[] };
const names = (body: { groups: Group[] }) =>
  Object.fromEntries(body.groups.map((g) => [g.kind, g.items.map((i) => i.name)]));

const otherLabCtx = (): LabContext => ({
  actor: lab.w.outsider.actor,
  labId: lab.w.otherLabId,
  labName: "Other Lab",
  role: "manager",
});

describe("lab search", () => {
  it("finds every kind of object, grouped in order, each with context and a link", async () => {
    const ctx = lab.ctx("manager");
    const study = await seedStudy(ctx, "Quillwort dorsal study");
    const sp = await seedSpecimen(ctx, study.id, {
      label: "QW-1",
      condition: "Quillwort inhibitor 5 µM",
      stage: "HH31",
      genotype: "wt",
    });
    const upload = await seedUpload(ctx, sp.id, "QUILLWORT_scan_01.png");
    const readout = await seedReadout(ctx, upload, 41.2);
    const m = await database();
    const kinetics = await m.LabKinetics.create({
      labId: ctx.labId,
      name: "Quillwort activator",
      description: null,
      createdBy: ctx.actor.userId,
    });
    const fit = await seedFit(ctx, "Quillwort fit", { kind: "lab", id: kinetics.id });
    const run = await seedRun(ctx, "Quillwort run", "Schnakenberg");
    const thread = await seedThread(ctx, { type: "readout", id: readout.id }, "Is the quillwort spacing wider?");

    const res = await search("quillwort");
    expect(res.status).toBe(200);
    expect(res.body.q).toBe("quillwort");
    expect(res.body.groups.map((g: Group) => g.label)).toEqual([
      "Studies",
      "Specimens",
      "Uploads",
      "Readouts",
      "Kinetics",
      "Fits",
      "Runs",
      "Discussions",
    ]);
    expect(names(res.body)).toEqual({
      study: ["Quillwort dorsal study"],
      specimen: ["QW-1"],
      upload: ["QUILLWORT_scan_01.png"],
      readout: ["Readout of QUILLWORT_scan_01.png"],
      kinetics: ["Quillwort activator"],
      fit: ["Quillwort fit"],
      run: ["Quillwort run"],
      discussion: ["Discussion on the readout of “QUILLWORT_scan_01.png”"],
    });
    const hit = (kind: string) => res.body.groups.find((g: Group) => g.kind === kind).items[0];
    const base = `/labs/${lab.w.labId}`;
    expect(hit("study")).toMatchObject({ context: "dorsal skin · chick", href: `${base}/studies/${study.id}` });
    expect(hit("specimen")).toMatchObject({
      context: "Quillwort inhibitor 5 µM · HH31 · wt · study Quillwort dorsal study",
      href: `${base}/specimens/${sp.id}`,
    });
    expect(hit("upload")).toMatchObject({
      context: "specimen QW-1 · Quillwort inhibitor 5 µM · HH31 · wt",
      href: `${base}/specimens/${sp.id}`,
    });
    expect(hit("readout")).toMatchObject({
      context: "λ 41.20 ± 0.50 µm · specimen QW-1 · Quillwort inhibitor 5 µM",
      href: `${base}/readouts/${readout.id}`,
    });
    expect(hit("kinetics")).toMatchObject({
      context: "lab kinetics · version 1",
      href: `${base}/kinetics/${kinetics.id}`,
    });
    expect(hit("fit")).toMatchObject({ context: `fit · finished · ${kinetics.id}`, href: `${base}/fits/${fit.id}` });
    expect(hit("run")).toMatchObject({ context: "running · Schnakenberg", href: `${base}/runs/${run.id}` });
    expect(hit("discussion")).toMatchObject({
      id: thread.id,
      context: "open · “Is the quillwort spacing wider?”",
      href: `${base}/readouts/${readout.id}`,
    });
  });

  it("finds an upload by its specimen's condition, stage or genotype, not only its file name", async () => {
    const ctx = lab.ctx("scientist");
    const study = await seedStudy(ctx, "Plain study");
    const sp = await seedSpecimen(ctx, study.id, {
      label: "P1",
      condition: "Zedoary-treated",
      stage: "E13.5",
      genotype: "Eda-ko",
    });
    await seedUpload(ctx, sp.id, "plain-frame.png");
    for (const q of ["zedoary", "e13.5", "EDA-KO"]) {
      const res = await search(q);
      expect(names(res.body).upload, q).toEqual(["plain-frame.png"]);
    }
  });

  it("an empty result is an empty list of groups", async () => {
    const res = await search("no object is called this");
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ q: "no object is called this", groups: [] });
  });

  it("never shows another lab's objects, and another lab cannot be searched", async () => {
    await seedStudy(lab.ctx("manager"), "Marram study here");
    await seedStudy(otherLabCtx(), "Marram study elsewhere");
    expect(names((await search("marram")).body)).toEqual({ study: ["Marram study here"] });
    const fromOutside = await search("marram", { labId: lab.w.otherLabId });
    expect(fromOutside.status).toBe(404);
    const own = await lab.api("GET", SEARCH, {
      who: lab.w.outsider,
      params: { labId: lab.w.otherLabId },
      query: "q=marram",
    });
    expect(names(own.body)).toEqual({ study: ["Marram study elsewhere"] });
    const intoOurs = await lab.api("GET", SEARCH, { who: lab.w.outsider, query: "q=marram" });
    expect(intoOurs.status).toBe(404);
  });

  it("takes % _ and ' literally", async () => {
    const ctx = lab.ctx("manager");
    for (const name of ["Cover 100% esc", "Cover 1000 esc", "pax_6 esc", "paxe6 esc", "O'Hare line esc"])
      await seedStudy(ctx, name);
    expect(names((await search("0% esc")).body).study).toEqual(["Cover 100% esc"]);
    expect(names((await search("x_6")).body).study).toEqual(["pax_6 esc"]);
    expect(names((await search("o'hare")).body).study).toEqual(["O'Hare line esc"]);
    expect(names((await search("%%")).body).study).toBeUndefined();
  });

  it("ignores the case of A–Z and matches other letters as typed, on either database", async () => {
    await seedStudy(lab.ctx("manager"), "Ébauche of scales");
    expect(names((await search("ÉBAUCHE OF")).body).study).toEqual(["Ébauche of scales"]);
    expect(names((await search("BAUCHE")).body).study).toEqual(["Ébauche of scales"]);
    // PostgreSQL's ILIKE would match é to É, SQLite's LIKE would not; search does not on either.
    expect(names((await search("ébauche")).body).study).toBeUndefined();
  });

  it("finds catalogue kinetics only when this lab's fits or runs used them", async () => {
    await seedFit(lab.ctx("modeller"), "Catalogue user", { kind: "catalogue", id: "brusselator" });
    const used = await search("brussel");
    expect(used.body.groups[0]).toMatchObject({
      kind: "kinetics",
      items: [
        {
          name: "Brusselator",
          context: "catalogue · used by 1 fit",
          href: `/labs/${lab.w.labId}/kinetics/brusselator`,
        },
      ],
    });
    expect(names((await search("gray-scott")).body).kinetics).toBeUndefined();
  });

  it("does not find deleted comments", async () => {
    const ctx = lab.ctx("collaborator");
    const study = await seedStudy(lab.ctx("manager"), "Thread host");
    const sp = await seedSpecimen(lab.ctx("manager"), study.id, { label: "T1", condition: "control" });
    const upload = await seedUpload(lab.ctx("manager"), sp.id, "host.png");
    const thread = await seedThread(ctx, { type: "upload", id: upload.id }, "a remark about sorrel");
    const m = await database();
    expect(names((await search("sorrel")).body).discussion).toHaveLength(1);
    await m.Comment.update({ deletedAt: new Date() }, { where: { threadId: thread.id } });
    expect(names((await search("sorrel")).body).discussion).toBeUndefined();
  });

  it("shows at most `limit` hits per kind and says there are more", async () => {
    for (const n of [1, 2, 3]) await seedStudy(lab.ctx("manager"), `Limitwort ${n}`);
    const two = await search("limitwort", { limit: 2 });
    expect(two.body.groups).toEqual([expect.objectContaining({ kind: "study", more: true })]);
    expect(two.body.groups[0].items).toHaveLength(2);
    const all = await search("limitwort", { limit: 3 });
    expect(all.body.groups[0]).toMatchObject({ more: false });
    expect(all.body.groups[0].items).toHaveLength(3);
  });

  it("every member role may search, and gets the same answer", async () => {
    await seedStudy(lab.ctx("manager"), "Rolewort study");
    for (const who of ROLES) {
      const res = await search("rolewort", { who });
      expect(res.status, who).toBe(200);
      expect(names(res.body), who).toEqual({ study: ["Rolewort study"] });
    }
  });

  it("answers 400 naming the field when the text is too short or the limit is wrong", async () => {
    for (const q of ["a", "  a  ", ""]) {
      const res = await search(q);
      expect(res.status, JSON.stringify(q)).toBe(400);
      expect(res.body.error.message).toBe("Search: type at least 2 characters");
    }
    const noQ = await lab.api("GET", SEARCH, { query: "" });
    expect(noQ.status).toBe(400);
    expect(noQ.body.error.message).toBe("Search: type at least 2 characters");
    const limit = await search("ab", { limit: 51 });
    expect(limit.status).toBe(400);
    expect(limit.body.error.message).toBe("Number of results: at most 50");
    const control = await search("a\u0000b");
    expect(control.status).toBe(400);
    expect(control.body.error.message).toBe("Search: remove control characters");
  });

  it("the results page: nothing before a search, the reason when the text cannot be searched, 50 hits per kind", async () => {
    const ctx = lab.ctx("collaborator");
    expect(await loadSearchPage(ctx, undefined)).toEqual({ q: "", answer: null, problem: null, limit: 50 });
    expect(await loadSearchPage(ctx, " a ")).toMatchObject({
      answer: null,
      problem: "Search: type at least 2 characters",
    });
    for (let n = 1; n <= 6; n++) await seedStudy(lab.ctx("manager"), `Pagewort ${n}`);
    const page = await loadSearchPage(ctx, " pagewort ");
    expect(page.q).toBe("pagewort");
    expect(page.answer!.groups[0].items).toHaveLength(6);
  });
});
