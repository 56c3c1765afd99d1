/**
 * A bench scientist uploads an ImageJ-style Results workbook (XLSX): the upload shows as a table,
 * the readout refuses the ambiguous header naming the columns by letter, and a re-run with the
 * columns chosen says which columns it read. Positions by hand: (0,0), (6,0), (0,6) µm.
 */
import { writeWorkbook } from "../support/xlsx-fixtures";
import { unique } from "./support/demo";
import { expect, test } from "./pages/fixtures";
import { ReadoutPage } from "./pages/readout-page";
import { SpecimenPage } from "./pages/specimen-page";
import { StudiesPage } from "./pages/studies-page";
import { StudyPage } from "./pages/study-page";

test.use({ role: "scientist" });

test("an XLSX table with an ambiguous header, then read with the columns chosen", async ({ lab }) => {
  const studyName = unique("E2E spot tables");
  const studies = await lab.open(StudiesPage);
  await studies.create({ name: studyName, tissue: "skin", organism: "chick" });
  await studies.table.row(studyName).getByRole("link", { name: studyName }).click();
  const study = lab.on(StudyPage);
  await study.addSpecimen({ label: "CK-T1", condition: "control", stage: "E8" });
  await study.specimens.row("CK-T1").getByRole("link", { name: "CK-T1" }).click();
  const specimen = lab.on(SpecimenPage);
  await specimen.expectHeading("Specimen CK-T1");

  const workbook = await writeWorkbook({
    Results: [
      ["", "X", "Y", "XM", "YM"],
      [1, 0, 0, 0.1, 0.1],
      [2, 6, 0, 6.1, 0.1],
      [3, 0, 6, 0.1, 6.1],
    ],
  });
  await specimen.upload({
    name: "Results.xlsx",
    mimeType: "application/vnd.openxmlformats-officedocument.spreadsheetml.sheet",
    buffer: Buffer.from(workbook),
  });
  await expect(specimen.uploadRow("Results.xlsx")).toContainText("table · xlsx");

  await specimen.openReadout(0);
  const readout = lab.on(ReadoutPage);
  await expect(readout.status).toHaveText("failed");
  await expect(readout.error).toContainText('The header has 2 columns that could be x: B ("X"), D ("XM")');

  await readout.chooseColumns({ x: "X", y: "Y" });
  await readout.rerun();
  await expect(readout.status).toHaveText("finished");
  await expect(readout.tableColumns).toContainText(
    'from the sheet “Results”. Columns chosen: x = B ("X"), y = C ("Y"); unit µm',
  );
});
