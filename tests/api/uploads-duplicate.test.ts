/**
 * An identical file (same SHA-256) uploaded again to a specimen is flagged with the earlier upload's
 * name, in the upload's answer and in the specimen's list; the same file on another specimen is not
 * a repeat of it (a warning of the comparison covers that case). Comparisons and fits count it once
 * (tests/api/readouts-comparison.test.ts, tests/api/fits-replicates.test.ts).
 */
import { describe, expect, it } from "vitest";
import { encodePng } from "@/lib/imaging";
import { makeStripes } from "@/lib/synthetic";
import { setupReadoutLab } from "../support/readouts";

const { api, newSpecimen, uploadFile } = setupReadoutLab();

describe("the same file uploaded twice to a specimen", () => {
  it("is flagged with the first upload's name, and only on that specimen", async () => {
    const bytes = await encodePng(makeStripes({ width: 64, height: 64, wavelengthPx: 8, angleDeg: 0 }));
    const fields = { pixelSizeUm: "0.5" };
    const a = await newSpecimen();
    const b = await newSpecimen();
    const first = await uploadFile(a.id, "E1-left.png", bytes, fields);
    expect(first.status).toBe(201);
    const again = await uploadFile(a.id, "E1-left-copy.png", bytes, fields);
    expect(again.status).toBe(201);
    expect((again.body as unknown as { duplicateOf: unknown }).duplicateOf).toEqual({
      id: first.body.id,
      filename: "E1-left.png",
    });
    const elsewhere = await uploadFile(b.id, "E2.png", bytes, fields);
    expect((elsewhere.body as unknown as { duplicateOf: unknown }).duplicateOf).toBeNull();
    const list = await api("GET /api/v1/labs/[labId]/specimens/[specimenId]/uploads", { specimenId: a.id });
    const items = ((await list.json()) as { items: { filename: string; duplicateOf: { filename: string } | null }[] })
      .items;
    expect(Object.fromEntries(items.map((u) => [u.filename, u.duplicateOf?.filename ?? null]))).toEqual({
      "E1-left.png": null,
      "E1-left-copy.png": "E1-left.png",
    });
  });
});
