import { checkHealth } from "@/lib/server/health";

export const runtime = "nodejs";
export const dynamic = "force-dynamic";

export async function GET() {
  const h = await checkHealth();
  return Response.json(h, { status: h.ok ? 200 : 503 });
}
