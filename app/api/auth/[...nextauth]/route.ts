import NextAuth from "next-auth";
import { authOptions } from "@/lib/server/accounts/auth";
import { guardAuthRequest } from "@/lib/server/accounts/auth-limits";

export const runtime = "nodejs";

async function handler(request: Request, ctx: { params: Promise<{ nextauth: string[] }> }) {
  const limited = await guardAuthRequest(request, (await ctx.params).nextauth ?? []);
  if (limited) return limited;
  return NextAuth(authOptions())(request, ctx);
}

export { handler as GET, handler as POST };
