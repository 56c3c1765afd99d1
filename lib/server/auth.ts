/**
 * next-auth configuration: JWT sessions, password sign-in, and sign-in by e-mailed link for
 * people who already have an account (an unknown address gets the same "check your mail" page
 * and no mail, so addresses cannot be probed).
 */
import SequelizeAdapter from "@next-auth/sequelize-adapter";
import type { NextAuthOptions } from "next-auth";
import type { Adapter } from "next-auth/adapters";
import CredentialsProvider from "next-auth/providers/credentials";
import EmailProvider from "next-auth/providers/email";
import { loginSchema } from "@/lib/contracts/account";
import { verifyPassword } from "./passwords";
import { services } from "./services";

const g = globalThis as unknown as { __morphokinAuth?: NextAuthOptions };

export const SIGN_IN_LINK_MINUTES = 30;

function buildAuthOptions(): NextAuthOptions {
  const { db, config, mailer } = services();
  const m = db.models;
  return {
    adapter: SequelizeAdapter(db.sequelize, {
      models: { User: m.User as never, Account: m.Account as never, Session: m.AuthSession as never, VerificationToken: m.VerificationToken as never },
      synchronize: false,
    }) as Adapter,
    session: { strategy: "jwt", maxAge: 30 * 24 * 3600 },
    secret: process.env.NEXTAUTH_SECRET,
    pages: { signIn: "/login", verifyRequest: "/login/check-email", error: "/login" },
    providers: [
      CredentialsProvider({
        name: "password",
        credentials: { email: { type: "email" }, password: { type: "password" } },
        async authorize(raw) {
          const parsed = loginSchema.safeParse(raw);
          if (!parsed.success) return null;
          await db.ready;
          const user = await m.User.findOne({ where: { email: parsed.data.email } });
          if (!user || !(await verifyPassword(parsed.data.password, user.passwordHash))) return null;
          return { id: user.id, email: user.email, name: user.name };
        },
      }),
      EmailProvider({
        server: config.smtp.url,
        from: config.smtp.from,
        maxAge: SIGN_IN_LINK_MINUTES * 60,
        async sendVerificationRequest({ identifier, url }) {
          await mailer.send({
            to: identifier,
            subject: "Your Morphokin sign-in link",
            text: `Open this link to sign in to Morphokin:\n\n${url}\n\nThe link works once and expires in ${SIGN_IN_LINK_MINUTES} minutes. If you did not ask for it, ignore this message.`,
          });
        },
      }),
    ],
    callbacks: {
      async signIn({ user, email }) {
        if (email?.verificationRequest) {
          await db.ready;
          const known = await m.User.findOne({ where: { email: String(user.email ?? "").toLowerCase() } });
          if (!known) return "/login/check-email";
        }
        return true;
      },
      jwt({ token, user }) {
        if (user) token.uid = user.id;
        return token;
      },
      session({ session, token }) {
        if (token.uid) session.user = { ...session.user, id: token.uid, email: token.email ?? session.user?.email ?? "" };
        return session;
      },
    },
  };
}

export function authOptions(): NextAuthOptions {
  return (g.__morphokinAuth ??= buildAuthOptions());
}
