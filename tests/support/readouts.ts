/**
 * What the readout API tests share: a study in the test lab, specimens in it, uploads through the
 * route (which start their readout), and waiting for a readout to finish.
 */
import { expect } from "vitest";
import { createSpecimen } from "@/lib/server/studies/specimens";
import { createStudy } from "@/lib/server/studies/studies";
import type { ReadoutDetailDto, ReadoutDto } from "@/lib/server/readouts/readouts";
import { waitForJob } from "@/lib/server/jobs/queue";
import { multipart } from "./api";
import { setupLabApi, type LabApi } from "./lab-api";

export interface UploadAnswer {
  status: number;
  body: { id: string; readout: ReadoutDto | null; readoutError: string | null; error?: { message: string } };
}

/** The lab fixture plus the readout helpers, as the scientist of the test lab. */
export function setupReadoutLab() {
  let studyId = "";
  const lab: LabApi = setupLabApi({
    who: "scientist",
    setup: async (l) => {
      const study = await createStudy(l.ctx("scientist"), {
        name: "Readout study",
        tissue: "skin",
        organism: "chick",
        description: null,
      });
      studyId = study.id;
    },
  });
  const ctxOf = () => lab.ctx("scientist");
  /** `"METHOD /path"` with its parameters, as the scientist; the raw Response. */
  const api = (
    key: string,
    params: Record<string, string>,
    extra: { json?: unknown; body?: BodyInit; query?: string } = {},
  ) => {
    const [method, path] = key.split(" ") as ["GET" | "POST" | "DELETE", string];
    return lab.raw(method, path, { params, ...extra });
  };
  async function newSpecimen(condition = "control") {
    return createSpecimen(ctxOf(), studyId, {
      label: `S-${Math.random().toString(36).slice(2, 7)}`,
      condition,
      stage: null,
      genotype: null,
      notes: null,
    });
  }
  /** Uploads through the route; returns the upload with the readout it started. */
  async function uploadFile(
    specimenId: string,
    name: string,
    bytes: Uint8Array,
    fields: Record<string, string> = {},
  ): Promise<UploadAnswer> {
    const res = await api(
      "POST /api/v1/labs/[labId]/specimens/[specimenId]/uploads",
      { specimenId },
      { body: multipart({ name, bytes }, fields) },
    );
    return { status: res.status, body: (await res.json()) as UploadAnswer["body"] };
  }
  async function finished(readout: ReadoutDto | null): Promise<ReadoutDetailDto> {
    expect(readout).not.toBeNull();
    await waitForJob(readout!.jobId!, 30_000);
    const res = await api("GET /api/v1/labs/[labId]/readouts/[readoutId]", { readoutId: readout!.id });
    expect(res.status).toBe(200);
    return (await res.json()) as ReadoutDetailDto;
  }
  return { lab, ctxOf, api, newSpecimen, uploadFile, finished };
}
