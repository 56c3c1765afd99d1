/** Search hits among a lab's data: studies, specimens, uploads and readouts. */
import "server-only";
import { joinContext, statusWord, wavelengthText } from "./context";
import { anyColumnMatches } from "./match";
import { fetchSize, keepLimit, NEWEST_FIRST, type KindFound, type KindSearch } from "./kind-search";

export async function searchStudies(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.Study.findAll({
    where: {
      labId: s.labId,
      ...anyColumnMatches(s.match, ["study.name", "study.tissue", "study.organism", "study.description"]),
    },
    attributes: ["id", "name", "tissue", "organism"],
    order: NEWEST_FIRST,
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((r) => ({
      kind: "study",
      id: r.id,
      name: r.name,
      context: joinContext([r.tissue, r.organism]),
      href: `/labs/${s.labId}/studies/${r.id}`,
    })),
  );
}

export async function searchSpecimens(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.Specimen.findAll({
    where: {
      labId: s.labId,
      ...anyColumnMatches(s.match, [
        "specimen.label",
        "specimen.condition",
        "specimen.stage",
        "specimen.genotype",
        "specimen.notes",
      ]),
    },
    attributes: ["id", "label", "condition", "stage", "genotype"],
    include: [{ model: s.m.Study, as: "study", attributes: ["name"] }],
    order: NEWEST_FIRST.map(([c, d]) => [c, d]) as [string, string][],
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((r) => {
      const study = (r as unknown as { study?: { name: string } }).study;
      return {
        kind: "specimen",
        id: r.id,
        name: r.label,
        context: joinContext([r.condition, r.stage, r.genotype, study && `study ${study.name}`]),
        href: `/labs/${s.labId}/specimens/${r.id}`,
      };
    }),
  );
}

interface SpecimenFacts {
  label: string;
  condition: string;
  stage: string | null;
  genotype: string | null;
}

/** Uploads by file name and by their specimen's condition, stage and genotype. */
export async function searchUploads(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.Upload.findAll({
    where: {
      labId: s.labId,
      state: "stored",
      ...anyColumnMatches(s.match, ["upload.filename", "specimen.condition", "specimen.stage", "specimen.genotype"]),
    },
    attributes: ["id", "filename", "specimenId", "createdAt"],
    include: [
      { model: s.m.Specimen, as: "specimen", required: true, attributes: ["label", "condition", "stage", "genotype"] },
    ],
    order: NEWEST_FIRST,
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((r) => {
      const sp = (r as unknown as { specimen: SpecimenFacts }).specimen;
      return {
        kind: "upload",
        id: r.id,
        name: r.filename,
        context: joinContext([`specimen ${sp.label}`, sp.condition, sp.stage, sp.genotype]),
        href: `/labs/${s.labId}/specimens/${r.specimenId}`,
      };
    }),
  );
}

/** Readouts have no name of their own: they are found by their file's name and their specimen's label. */
export async function searchReadouts(s: KindSearch): Promise<KindFound> {
  const rows = await s.m.Readout.findAll({
    where: {
      labId: s.labId,
      ...anyColumnMatches(s.match, ["upload.filename", "upload->specimen.label"]),
    },
    attributes: ["id", "status", "wavelengthUm", "uncertaintyUm", "periodFound", "createdAt"],
    include: [
      {
        model: s.m.Upload,
        as: "upload",
        required: true,
        attributes: ["filename"],
        include: [{ model: s.m.Specimen, as: "specimen", required: true, attributes: ["label", "condition"] }],
      },
    ],
    order: NEWEST_FIRST,
    limit: fetchSize(s),
  });
  return keepLimit(
    s,
    rows.map((r) => {
      const upload = (r as unknown as { upload: { filename: string; specimen: SpecimenFacts } }).upload;
      const found =
        r.status === "succeeded"
          ? (wavelengthText(r.wavelengthUm, r.uncertaintyUm) ?? (r.periodFound === false ? "no period" : null))
          : statusWord(r.status);
      return {
        kind: "readout",
        id: r.id,
        name: `Readout of ${upload.filename}`,
        context: joinContext([found, `specimen ${upload.specimen.label}`, upload.specimen.condition]),
        href: `/labs/${s.labId}/readouts/${r.id}`,
      };
    }),
  );
}
