/**
 * Who is asking, as a small DTO (never a user row). Its own file, with no imports, so modules
 * that only name the type (access, audit, tokens) do not import the session code that finds it.
 */
import "server-only";

export interface Actor {
  userId: string;
  email: string;
  name: string | null;
  via: "session" | "token";
}
