/** The lab dashboard's data in one call: four independent lists read at the same time. */
import "server-only";
import { can } from "@/lib/access/permissions";
import type { LabContext } from "../access";
import { listAudit } from "../audit";
import { listFits } from "../fits/fits";
import { listReadouts } from "../readouts/readouts";
import { listStudies } from "../studies/studies";

export async function loadDashboard(ctx: LabContext) {
  const [studies, fits, readouts, audit] = await Promise.all([
    listStudies(ctx, { page: 1, pageSize: 6, sort: "updatedAt", dir: "desc", q: "" }),
    listFits(ctx, { page: 1, pageSize: 5, sort: "createdAt", dir: "desc", q: "" }),
    listReadouts(ctx, {}, { page: 1, pageSize: 5, sort: "createdAt", dir: "desc", q: "" }),
    // Only roles that may read the audit trail see its latest entries.
    can(ctx.role, "audit.read")
      ? listAudit(ctx, { page: 1, pageSize: 8, sort: "at", dir: "desc", q: "" })
      : Promise.resolve(null),
  ]);
  return { studies, fits, readouts, audit };
}
