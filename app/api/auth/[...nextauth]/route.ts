import NextAuth from "next-auth";
import { authOptions } from "@/lib/server/auth";

export const runtime = "nodejs";

function handler(request: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  return NextAuth(authOptions())(request, ctx);
}

export { handler as GET, handler as POST };
