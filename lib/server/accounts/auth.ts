/**
 * next-auth configuration: JWT sessions with a server-side session record (lib/server/accounts/sessions.ts),
 * password sign-in, and sign-in by e-mailed link. Known and unknown addresses get the same answer
 * after the same work: a password is always checked against a bcrypt hash (a dummy one for an
 * unknown address), and the link request always ends on the "check your e-mail" page while the
 * mail, if any, is sent off the request path.
 */
import "server-only";
import { createHash, randomBytes } from "node:crypto";
import SequelizeAdapter from "@next-auth/sequelize-adapter";
import type { NextAuthOptions } from "next-auth";
import type { Adapter } from "next-auth/adapters";
import CredentialsProvider from "next-auth/providers/credentials";
import EmailProvider from "next-auth/providers/email";
import { loginSchema } from "@/lib/contracts/account";
import type { OutgoingMail } from "../mail";
import { ACCOUNT_MAIL_SUBJECTS } from "./account-mail";
import { recordSignIn } from "../audit";
import { verifyPassword } from "./passwords";
import { clearFailedPasswords, lockedForS, recordFailedPassword } from "../web/rate-limit";
import { services } from "../services";
import { closeSession, openSession, sessionIsOpen } from "./sessions";

const g = globalThis as unknown as { __morphokinAuth?: NextAuthOptions };

export const SIGN_IN_LINK_MINUTES = 30;

/** Sends mail after the answer has gone: the request takes the same time whether or not a mail is sent. */
export function sendInBackground(mail: OutgoingMail): void {
  setImmediate(() => {
    services()
      .mailer.send(mail)
      .catch((err) => console.error(`mail to ${mail.to} (“${mail.subject}”) was not sent:`, err));
  });
}

export function signInLinkMail(to: string, url: string): OutgoingMail {
  return {
    to,
    subject: ACCOUNT_MAIL_SUBJECTS.signInLink,
    text: `Open this link to sign in to Morphokin:\n\n${url}\n\nThe link works once and expires in ${SIGN_IN_LINK_MINUTES} minutes. If you did not ask for it, ignore this message.`,
  };
}

/**
 * A one-time sign-in link made the way next-auth's e-mail provider makes its own
 * (node_modules/next-auth/core/lib/email/signin.js: token stored as SHA-256 of token + secret),
 * for mail that offers a direct sign-in (the "you already have an account" answer to a sign-up).
 */
export async function createSignInLink(email: string, callbackPath = "/labs"): Promise<string> {
  const { db, config } = services();
  await db.ready;
  const token = randomBytes(32).toString("hex");
  const secret = config.nextAuthSecret ?? "";
  await db.models.VerificationToken.create({
    identifier: email,
    token: createHash("sha256").update(`${token}${secret}`).digest("hex"),
    expires: new Date(Date.now() + SIGN_IN_LINK_MINUTES * 60_000),
  } as never);
  const base = config.appUrl.replace(/\/$/, "");
  return `${base}/api/auth/callback/email?${new URLSearchParams({ callbackUrl: `${base}${callbackPath}`, token, email })}`;
}

/** The password check behind the sign-in form: lockout first, then one bcrypt compare whatever the address. */
export async function checkPassword(raw: unknown): Promise<{ id: string; email: string; name: string | null } | null> {
  const parsed = loginSchema.safeParse(raw);
  if (!parsed.success) return null;
  const { db } = services();
  await db.ready;
  const { email, password } = parsed.data;
  if ((await lockedForS(email)) > 0) return null;
  const user = await db.models.User.findOne({ where: { email } });
  const ok = await verifyPassword(password, user?.passwordHash);
  if (!user || !ok) {
    const lockedUntil = await recordFailedPassword(email);
    // The same audit work for known and unknown addresses; the reason never says which it was.
    await recordSignIn({ outcome: "failed", email, method: "password", reason: "wrong e-mail or password" });
    if (lockedUntil) await recordSignIn({ outcome: "locked", email, method: "password", lockedUntil });
    return null;
  }
  await clearFailedPasswords(email);
  return { id: user.id, email: user.email, name: user.name };
}

function buildAuthOptions(): NextAuthOptions {
  const { db, config } = services();
  const m = db.models;
  return {
    adapter: SequelizeAdapter(db.sequelize, {
      models: {
        User: m.User as never,
        Account: m.Account as never,
        Session: m.AuthSession as never,
        VerificationToken: m.VerificationToken as never,
      },
      synchronize: false,
    }) as Adapter,
    session: { strategy: "jwt", maxAge: 30 * 24 * 3600 },
    secret: services().config.nextAuthSecret,
    pages: { signIn: "/login", verifyRequest: "/login/check-email", error: "/login" },
    providers: [
      CredentialsProvider({
        name: "password",
        credentials: { email: { type: "email" }, password: { type: "password" } },
        authorize: (raw) => checkPassword(raw),
      }),
      EmailProvider({
        server: config.smtp.url,
        from: config.smtp.from,
        maxAge: SIGN_IN_LINK_MINUTES * 60,
        async sendVerificationRequest({ identifier, url }) {
          // Same lookup for every address; the mail (only to an account) leaves after the answer.
          await db.ready;
          const known = await m.User.findOne({ where: { email: identifier.toLowerCase() }, attributes: ["id"] });
          if (known) sendInBackground(signInLinkMail(identifier, url));
        },
      }),
    ],
    callbacks: {
      async signIn({ user, email, account }) {
        // A link is only ever mailed to an account, but never let the link callback create one.
        if (account?.provider === "email" && !email?.verificationRequest) {
          await db.ready;
          return !!(await m.User.findOne({
            where: { email: String(user.email ?? "").toLowerCase() },
            attributes: ["id"],
          }));
        }
        return true;
      },
      async jwt({ token, user }) {
        if (user) {
          token.uid = user.id;
          token.sid = await openSession(user.id);
        }
        return token;
      },
      async session({ session, token }) {
        // A closed session (signed out, password changed) is no session, whatever the cookie says.
        if (!token.uid || !(await sessionIsOpen(token.sid, String(token.uid))))
          return { expires: session.expires } as typeof session;
        session.user = { ...session.user, id: token.uid, email: token.email ?? session.user?.email ?? "" };
        session.sid = String(token.sid);
        return session;
      },
    },
    events: {
      async signIn({ user, account }) {
        await recordSignIn({
          outcome: "succeeded",
          email: String(user.email ?? ""),
          method: account?.provider === "email" ? "an e-mailed link" : "password",
        });
      },
      async signOut({ token }) {
        await closeSession(token?.sid);
      },
    },
  };
}

export function authOptions(): NextAuthOptions {
  return (g.__morphokinAuth ??= buildAuthOptions());
}
