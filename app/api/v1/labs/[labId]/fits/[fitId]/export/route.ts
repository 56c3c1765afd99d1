import { z } from "zod";
import { exportFit } from "@/lib/server/fits/export";
import { AppError } from "@/lib/server/errors";
import { labRoute } from "@/lib/server/web/lab-route";

export const runtime = "nodejs";

const querySchema = z.enum(["csv", "json", "methods"], 'format must be "csv", "json" or "methods"');

/** A finished fit as a file: `?format=csv` (parameters and predictions), `json` (everything), `methods` (a paragraph). */
export const GET = labRoute<{ labId: string; fitId: string }>("lab.read", async (ctx, request, p) => {
  const format = querySchema.safeParse(new URL(request.url).searchParams.get("format") ?? "json");
  if (!format.success) throw new AppError("bad_input", format.error.issues[0].message);
  const file = await exportFit(ctx, p.fitId, format.data);
  return new Response(file.body, {
    headers: { "content-type": file.contentType, "content-disposition": `attachment; filename="${file.filename}"` },
  });
});
