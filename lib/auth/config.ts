import "server-only";
import NextAuth from "next-auth";
import Resend from "next-auth/providers/resend";
import { DrizzleAdapter } from "@auth/drizzle-adapter";
import { getDb } from "@/db/client";
import { accounts, sessions, userRoles, users, verificationTokens } from "@/db/schema";
import { env } from "@/lib/env";
import { sendMail } from "@/lib/mail/send";
import { SignInLinkEmail } from "@/emails/sign-in-link";
import { mergeCartAtSignIn } from "@/lib/checkout/cart-owner";

const LINK_MINUTES = 30;

/**
 * Secure cookies whenever the public address is https. Left alone, Auth.js decides from the
 * request's own protocol, which behind a TLS-terminating proxy that forwards no protocol is http;
 * undefined keeps that rule (AUTH_URL on https) for local addresses.
 */
export function secureCookiesFor(appUrl: string): true | undefined {
  return appUrl.startsWith("https://") ? true : undefined;
}

// Configured lazily so that building the app needs no database or secrets.
export const { handlers, auth, signIn, signOut } = NextAuth(() => {
  const config = env();
  const db = getDb();
  return {
    adapter: DrizzleAdapter(db, {
      usersTable: users,
      accountsTable: accounts,
      sessionsTable: sessions,
      verificationTokensTable: verificationTokens,
    }),
    secret: config.AUTH_SECRET,
    trustHost: true,
    session: { strategy: "database", maxAge: 30 * 24 * 60 * 60 },
    useSecureCookies: secureCookiesFor(config.APP_URL),
    // Pinned rather than left to the library's defaults: no script reads the session, and another
    // site's POST or subrequest does not carry it (RFC 6265bis, SameSite=Lax).
    cookies: { sessionToken: { options: { httpOnly: true, sameSite: "lax", path: "/" } } },
    pages: { signIn: "/sign-in", verifyRequest: "/sign-in/check-email", error: "/sign-in/problem" },
    providers: [
      Resend({
        from: config.MAIL_FROM,
        maxAge: LINK_MINUTES * 60,
        // The built-in sender posts to the hosted API directly; ours goes through the SDK and its configured base URL.
        async sendVerificationRequest({ identifier, url }) {
          const { host } = new URL(url);
          await sendMail({
            to: identifier,
            subject: "Your Fluxyard sign-in link",
            react: SignInLinkEmail({ url, host, minutesValid: LINK_MINUTES }),
          });
        },
      }),
    ],
    callbacks: {
      session({ session, user }) {
        session.user.id = user.id;
        return session;
      },
    },
    events: {
      // The visitor's cart (cookie) joins the member's cart; quantities add up, capped by stock.
      async signIn({ user }) {
        if (user.id) await mergeCartAtSignIn(user.id);
      },
      async createUser({ user }) {
        if (user.id) await db.insert(userRoles).values({ userId: user.id, role: "member" }).onConflictDoNothing();
      },
    },
  };
});
