/** Kinetics routes: the catalogue (any signed-in user), lab kinetics (kinetics.edit), analyses (lab.read). */
import type { KineticsDefinition } from "@/lib/kinetics";
import { createLabKinetics } from "@/lib/server/kinetics/kinetics";
import type { World } from "../../support/world";
import { ALL, MANAGER_ONLY, USER, lab, managerCtx, next, type Case, type Expect } from "./shared";

/** Schnakenberg written as expressions (Murray 2003 §2.4 form), a valid two-species lab kinetics. */
export const labSchnakenberg = (name = "Lab Schnakenberg"): KineticsDefinition => ({
  name,
  species: ["u", "v"],
  parameters: [
    { name: "a", default: 0.1, min: 0, max: 10, meaning: "production of u" },
    { name: "b", default: 0.9, min: 0, max: 10, meaning: "production of v" },
    { name: "d", default: 20, min: 1, max: 1000, meaning: "D_v/D_u" },
  ],
  reactions: ["a - u + u^2 * v", "b - u^2 * v"],
  diffusion: [1, "d"],
});

/** A kinetics created by the lab manager (so only the manager may edit or delete it). */
export const managersKinetics = async (w: World) =>
  createLabKinetics(managerCtx(w), { description: null, definition: labSchnakenberg(`K${next()}`) });

// Modellers may create (scope "own"); bench scientists and collaborators may not.
const EDITORS = (s: number): Expect => ({
  manager: s,
  scientist: 403,
  modeller: s,
  collaborator: 403,
  outsider: 404,
  anonymous: 401,
});

const base = { kinetics: "schnakenberg", parameters: { a: 0.1, b: 0.9, d: 20 } };

export const cases: Record<string, Case> = {
  "GET /api/v1/kinetics": { setup: async () => ({}), expect: USER(200) },
  "GET /api/v1/kinetics/[kineticsId]": {
    setup: async () => ({ params: { kineticsId: "schnakenberg" } }),
    expect: USER(200),
  },
  "GET /api/v1/labs/[labId]/kinetics": { setup: async (w) => ({ params: lab(w) }), expect: ALL(200) },
  "POST /api/v1/labs/[labId]/kinetics": {
    setup: async (w) => ({ params: lab(w), json: { definition: labSchnakenberg(`New ${next()}`) } }),
    expect: EDITORS(201),
  },
  "GET /api/v1/labs/[labId]/kinetics/[kineticsId]": {
    setup: async (w) => ({ params: lab(w, { kineticsId: (await managersKinetics(w)).id }) }),
    expect: ALL(200),
  },
  "PATCH /api/v1/labs/[labId]/kinetics/[kineticsId]": {
    setup: async (w) => ({
      params: lab(w, { kineticsId: (await managersKinetics(w)).id }),
      json: { definition: labSchnakenberg("Edited") },
    }),
    expect: MANAGER_ONLY(200),
  },
  "DELETE /api/v1/labs/[labId]/kinetics/[kineticsId]": {
    setup: async (w) => ({ params: lab(w, { kineticsId: (await managersKinetics(w)).id }) }),
    expect: MANAGER_ONLY(204),
  },
  "GET /api/v1/labs/[labId]/kinetics/[kineticsId]/versions": {
    setup: async (w) => ({ params: lab(w, { kineticsId: (await managersKinetics(w)).id }) }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/analyses/dispersion": {
    setup: async (w) => ({ params: lab(w), json: { ...base, lengthScaleUm: 10 } }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/analyses/turing-map": {
    setup: async (w) => ({
      params: lab(w),
      json: {
        ...base,
        x: { name: "a", min: 0.01, max: 0.5, n: 8 },
        y: { name: "b", min: 0.1, max: 2, n: 8 },
        wavenumbers: 32,
      },
    }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/analyses/sensitivities": {
    setup: async (w) => ({ params: lab(w), json: base }),
    expect: ALL(200),
  },
  "POST /api/v1/labs/[labId]/analyses/gradient": {
    setup: async (w) => ({
      params: lab(w),
      json: { ...base, parameter: "d", profile: { kind: "linear", from: 2, to: 40 }, length: 100, samples: 11 },
    }),
    expect: ALL(200),
  },
};
