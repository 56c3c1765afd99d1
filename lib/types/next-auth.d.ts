import "next-auth";
import "next-auth/jwt";

declare module "next-auth" {
  interface Session {
    user: { id: string; email: string; name?: string | null };
    /** The server-side session id (lib/server/accounts/sessions.ts). */
    sid?: string;
  }
}

declare module "next-auth/jwt" {
  interface JWT {
    uid?: string;
    sid?: string;
  }
}
